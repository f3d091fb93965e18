package org.slopewatch.curve;

/**
 * The outcome of fitting a snapshot: the curve, how closely it passes the quoted points, and
 * from how many points it was fitted.
 *
 * @param curve     the fitted curve, in basis points
 * @param rmseBp    root-mean-square distance between fitted and quoted yields, in basis points
 * @param points    number of quoted points fitted
 * @param svensson  true for the six-parameter Svensson form, false for plain Nelson–Siegel
 *                  ({@code beta3 = 0}, {@code tau2 = tau1})
 */
public record NssFit(NelsonSiegelSvensson curve, double rmseBp, int points, boolean svensson) {
}

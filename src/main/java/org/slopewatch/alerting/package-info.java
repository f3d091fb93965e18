/**
 * The daemon's alerting: the policy in force and its hot reload ({@link org.slopewatch.alerting.PolicyHolder},
 * {@link org.slopewatch.alerting.PolicyReloader}), the rule engine driven by the pipeline and the clock
 * ({@link org.slopewatch.alerting.AlertDesk}, {@link org.slopewatch.alerting.AlertTicker}), the content of a
 * notice ({@link org.slopewatch.alerting.AlertComposer}), and delivery from the journal's outbox with one
 * retry policy ({@link org.slopewatch.alerting.AlertDispatcher}).
 */
package org.slopewatch.alerting;

/**
 * The daemon's alerting: the policy in force ({@link org.slopewatch.alerting.PolicyHolder}), the
 * rule engine the pipeline drives at each step and tick ({@link org.slopewatch.alerting.AlertStage},
 * implemented by {@link org.slopewatch.alerting.AlertDesk}), the content of a notice
 * ({@link org.slopewatch.alerting.AlertComposer}, with a text of its own for each kind of notice in
 * {@link org.slopewatch.alerting.NoticeText}, every figure from the one status the decision was
 * made on), quiet periods and acknowledgements as the journal holds them, whichever instance on it
 * took them ({@link org.slopewatch.alerting.DeskState}, re-read when the journal's change counter
 * moved, before a notice is let out), and delivery from the journal's outbox with one
 * retry policy ({@link org.slopewatch.alerting.AlertDispatcher}); whether each rule can reach the
 * desk with the channels configured ({@link org.slopewatch.alerting.ChannelReach}) and which
 * channels' attempts are failing ({@link org.slopewatch.alerting.ChannelFailures}). Depends on the
 * journal and on delivery; the pipeline and the health checks depend on it.
 */
package org.slopewatch.alerting;

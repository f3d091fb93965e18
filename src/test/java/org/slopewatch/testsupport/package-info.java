/**
 * Real servers for the tests: the Kafka broker and the PostgreSQL server that {@code .ci/run}
 * starts and names in environment variables, or that these helpers start once per JVM with the
 * same {@code .ci/*.sh} scripts when the variables are absent.
 *
 * <p>Invariants: a test never silently skips for want of a server, it fails saying how to start
 * one; every test gets topics or databases of its own, so runs do not see each other's data.
 *
 * <p>For the fault tests with packaged daemons: {@link org.slopewatch.testsupport.DaemonProcess}
 * (an instance as its own process, on Kafka or the embedded defaults, with the settings the runs
 * share), {@link org.slopewatch.testsupport.ScenarioQuotes} (the quotes they send) and
 * {@link org.slopewatch.testsupport.JournalContents} (what a journal concluded, compared row for
 * row with an undisturbed run's).
 *
 * <p>Also {@link org.slopewatch.testsupport.FuzzTries}, which lets a long run give the fuzz
 * properties more tries than CI does ({@code -Dfuzz.tries=N}), and
 * {@link org.slopewatch.testsupport.RawHttp}, which writes an HTTP request on a plain socket so
 * that its path reaches the server exactly as given.
 */
package org.slopewatch.testsupport;

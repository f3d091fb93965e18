/**
 * Abuse tests of the running daemon: the bad-input corpus under {@code bench/faults/corpus} (quote
 * bodies and policy files, each with the answer it must get) sent over HTTP, to the policy parser,
 * to {@code vet-policy} and to the live reload. The invariant: every input is answered with its
 * reason, nothing from a hostile input is journalled as accepted, and the daemon keeps running.
 */
package org.slopewatch.abuse;

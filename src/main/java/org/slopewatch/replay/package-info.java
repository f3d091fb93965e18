/**
 * Offline replay: history files through the engine objects the daemon uses, into a report of
 * quarters, transitions, spells and lead times. Plain Java; opens no ports.
 */
package org.slopewatch.replay;

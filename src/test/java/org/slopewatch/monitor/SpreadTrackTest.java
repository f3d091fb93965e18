package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.spread.SpreadKey;

/** Replacing the latest value and revising earlier ones: re-run, and report any changed outcome. */
class SpreadTrackTest {

    private static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-2Y");

    private final SpreadTrack track = new SpreadTrack(
            new InversionMonitor(new MonitorDefinition(0, 0, 1, 365, List.of(new DaysInverted(2)))), KEY);
    private long seq;

    private List<MonitorEvent> record(String date, double bp) {
        return track.record(new Observation(LocalDate.parse(date), bp, ++seq));
    }

    @Test
    void aLaterValueForTheLatestDateReplacesTheProvisionalOne() {
        record("2026-03-02", 5);
        assertThat(record("2026-03-03", -4)).hasAtLeastOneElementOfType(Transition.class);
        List<MonitorEvent> replaced = record("2026-03-03", 2);
        // the inversion reported on 03-03 is withdrawn: that is a changed outcome, reported as a revision
        assertThat(replaced).singleElement().isInstanceOfSatisfying(Revision.class, r -> {
            assertThat(r.before()).extracting(Transition::to).containsExactly(SpreadState.INVERTED);
            assertThat(r.after()).isEmpty();
        });
        assertThat(track.state().state()).isEqualTo(SpreadState.NORMAL);
        assertThat(track.transitions()).isEmpty();
        assertThat(track.size()).isEqualTo(2);
    }

    @Test
    void theSameValueAgainChangesNothing() {
        record("2026-03-02", -5);
        assertThat(record("2026-03-02", -5)).isEmpty();
        assertThat(track.transitions()).hasSize(1);
    }

    @Test
    void aRevisionOfAnEarlierDateReRunsAndReportsTheChangedConfirmation() {
        record("2026-03-02", -1);
        record("2026-03-03", -1);
        List<MonitorEvent> confirmed = record("2026-03-04", -1);
        assertThat(confirmed).extracting(e -> ((Transition) e).to()).containsExactly(SpreadState.CONFIRMED);
        record("2026-03-05", -1);

        // the 03-03 value is revised to positive: the spell restarts on 03-04 and confirms on 03-06 at the earliest
        List<MonitorEvent> revised = record("2026-03-03", 3);
        assertThat(revised).singleElement().isInstanceOfSatisfying(Revision.class, r -> {
            assertThat(r.from()).isEqualTo("2026-03-03");
            assertThat(r.before()).extracting(t -> t.date() + " " + t.to()).containsExactly("2026-03-04 CONFIRMED");
            assertThat(r.after()).extracting(t -> t.date() + " " + t.to())
                    .containsExactly("2026-03-03 NORMAL", "2026-03-04 INVERTED");
        });
        assertThat(track.state().state()).isEqualTo(SpreadState.INVERTED);
        assertThat(record("2026-03-06", -1)).extracting(e -> ((Transition) e).to()).containsExactly(SpreadState.CONFIRMED);
    }

    @Test
    void aLateValueThatDeepensAnEndedSpellButChangesNoTransitionRestatesTheSpell() {
        record("2026-03-02", -5);
        record("2026-03-03", -5);
        record("2026-03-04", -5);
        Spell first = (Spell) record("2026-03-05", 5).stream().filter(e -> e instanceof Spell).findFirst().orElseThrow();
        record("2026-03-06", 5);
        List<Transition> transitions = track.transitions();

        List<MonitorEvent> revised = record("2026-03-03", -20);

        // the same dates cross the same thresholds: no revision, but the spell's figures are not what was reported
        assertThat(revised).singleElement().isInstanceOfSatisfying(SpellRestatement.class, r -> {
            assertThat(r.from()).isEqualTo("2026-03-03");
            assertThat(r.spells()).singleElement().satisfies(sp -> {
                assertThat(sp.id()).isEqualTo(first.id());
                assertThat(sp.end()).isEqualTo(first.end());
                assertThat(sp.deepestBp()).isEqualTo(-20.0);
                assertThat(sp.deepestDate()).isEqualTo("2026-03-03");
                // a day each below zero: 5 + 5 + 5 bp·days as first reported, 5 + 20 + 5 now
                assertThat(first.invertedAreaBpDays()).isEqualTo(15.0);
                assertThat(sp.invertedAreaBpDays()).isEqualTo(30.0);
            });
        });
        assertThat(track.transitions()).isEqualTo(transitions);
        assertThat(track.endedSpells()).singleElement().extracting(Spell::deepestBp).isEqualTo(-20.0);
        // a late value outside every spell changes no figure of one: nothing to report
        assertThat(record("2026-03-06", 7)).isEmpty();
    }

    @Test
    void aCheckpointOfAnEarlierVersionWithSpellsHeldBackStillReads() throws Exception {
        record("2026-03-02", -5);
        record("2026-03-03", -5);
        record("2026-03-05", 5);
        record("2026-03-06", -3);
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        track.write(new java.io.DataOutputStream(bytes));
        byte[] written = bytes.toByteArray();
        // an earlier version ended a track with the ids of spells held back until a revision: here 1 and 7
        java.io.ByteArrayOutputStream earlier = new java.io.ByteArrayOutputStream();
        java.io.DataOutputStream out = new java.io.DataOutputStream(earlier);
        out.write(written, 0, written.length - Integer.BYTES);
        out.writeInt(2);
        out.writeLong(1);
        out.writeLong(7);

        java.io.DataInputStream in = new java.io.DataInputStream(new java.io.ByteArrayInputStream(earlier.toByteArray()));
        SpreadTrack read = SpreadTrack.read(new InversionMonitor(track.rules()), KEY, EarlierObservations.NONE, in);

        assertThat(in.available()).as("bytes left unread").isZero();
        assertThat(read.transitions()).isEqualTo(track.transitions());
        assertThat(read.endedSpells()).isEqualTo(track.endedSpells()).hasSize(1);
        assertThat(SpreadStatus.of(read)).isEqualTo(SpreadStatus.of(track));
        java.io.ByteArrayOutputStream again = new java.io.ByteArrayOutputStream();
        read.write(new java.io.DataOutputStream(again));
        assertThat(again.toByteArray()).as("written again, as this version writes it").isEqualTo(written);
    }

    @Test
    void theSameValueAgainOnTheDayASpellEndedReportsNeitherTheTransitionNorTheSpellAgain() {
        // found by the soak test: the ended spell was reported again and clashed on its journal key
        record("2026-03-02", -5);
        record("2026-03-03", -5);
        assertThat(record("2026-03-04", 5)).hasAtLeastOneElementOfType(Spell.class).hasAtLeastOneElementOfType(Transition.class);

        assertThat(record("2026-03-04", 5)).noneMatch(e -> e instanceof Spell || e instanceof Transition || e instanceof Revision);
        assertThat(track.endedSpells()).hasSize(1);
        assertThat(track.transitions()).extracting(Transition::to).containsExactly(SpreadState.INVERTED, SpreadState.NORMAL);
    }

    @Test
    void aLateQuoteThatMakesTransitionsWhereThereWereNoneIsReportedAsARevision() {
        record("2026-03-02", 5);
        record("2026-03-04", 5);

        List<MonitorEvent> late = record("2026-03-03", -5);
        assertThat(late).singleElement().isInstanceOfSatisfying(Revision.class, r -> {
            assertThat(r.before()).isEmpty();
            assertThat(r.after()).extracting(t -> t.date() + " " + t.to()).containsExactly("2026-03-03 INVERTED", "2026-03-04 NORMAL");
        });
    }

    @Test
    void aRevisionThatChangesNoOutcomeIsQuiet() {
        record("2026-03-02", -1);
        record("2026-03-03", -1);
        record("2026-03-04", -1);
        assertThat(record("2026-03-03", -7)).isEmpty();
        assertThat(track.valueBp(1)).isEqualTo(-7);
    }

    @Test
    void aMissingEarlierDateIsInsertedInOrder() {
        record("2026-03-02", 4);
        record("2026-03-05", 4);
        record("2026-03-04", 4);
        assertThat(track.size()).isEqualTo(3);
        assertThat(track.date(1)).isEqualTo("2026-03-04");
    }
}

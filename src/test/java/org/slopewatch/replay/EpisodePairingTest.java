package org.slopewatch.replay;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Episodes of one rule and subject are paired in date order, as close as possible, within the window. */
class EpisodePairingTest {

    private static LocalDate d(String s) {
        return LocalDate.parse(s);
    }

    @Test
    void anExtraEpisodeInTheMiddleDoesNotShiftThePairsAfterIt() {
        // pairing by position would compare 2026-06-01 with 2026-03-01
        List<EpisodePairing.Pair> pairs = EpisodePairing.pair(List.of(d("2026-01-10"), d("2026-06-01")),
                List.of(d("2026-01-12"), d("2026-03-01"), d("2026-06-03")), 366);
        assertThat(pairs).containsExactly(new EpisodePairing.Pair(0, 0), new EpisodePairing.Pair(null, 1), new EpisodePairing.Pair(1, 2));
    }

    @Test
    void aLiveEpisodeWithoutCounterpartStaysAlone() {
        List<EpisodePairing.Pair> pairs = EpisodePairing.pair(List.of(d("1990-01-01"), d("2000-01-01")), List.of(d("2000-02-01")), 366);
        assertThat(pairs).containsExactly(new EpisodePairing.Pair(0, null), new EpisodePairing.Pair(1, 0));
    }

    @Test
    void datesFurtherApartThanTheWindowAreNotPaired() {
        List<EpisodePairing.Pair> pairs = EpisodePairing.pair(List.of(d("2020-01-01")), List.of(d("2021-01-02")), 366);
        assertThat(pairs).hasSize(2).contains(new EpisodePairing.Pair(0, null), new EpisodePairing.Pair(null, 0));
        assertThat(EpisodePairing.pair(List.of(d("2020-01-01")), List.of(d("2021-01-01")), 366))
                .as("366 days apart is within the window").containsExactly(new EpisodePairing.Pair(0, 0));
    }

    @Test
    void theCloserOfTwoCandidatesIsChosen() {
        // one live notice, two tried ones: it pairs with the one 5 days away, not the one 40 days away
        List<EpisodePairing.Pair> pairs = EpisodePairing.pair(List.of(d("2026-05-01")), List.of(d("2026-03-22"), d("2026-05-06")), 366);
        assertThat(pairs).containsExactly(new EpisodePairing.Pair(null, 0), new EpisodePairing.Pair(0, 1));
    }

    @Test
    void emptySidesGiveOnlyUnpairedNotices() {
        assertThat(EpisodePairing.pair(List.of(), List.of(d("2026-01-01")), 366)).containsExactly(new EpisodePairing.Pair(null, 0));
        assertThat(EpisodePairing.pair(List.of(d("2026-01-01")), List.of(), 366)).containsExactly(new EpisodePairing.Pair(0, null));
        assertThat(EpisodePairing.pair(List.of(), List.of(), 366)).isEmpty();
    }
}

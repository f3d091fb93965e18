package org.slopewatch.web;

import java.util.List;
import java.util.function.Function;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalReader;

/**
 * The columns of an export: one list for both formats, so that a CSV file and the JSON export of
 * the same request carry the same fields under the same names, in the same order.
 */
record ExportTable<T>(String name, List<Column<T>> columns) {

    /** A column: its name in the CSV header and the JSON items, and how a row gives its value. */
    record Column<T>(String name, Function<T, Object> value) {
    }

    List<String> names() {
        return columns.stream().map(Column::name).toList();
    }

    Object[] values(T row) {
        Object[] out = new Object[columns.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = columns.get(i).value().apply(row);
        }
        return out;
    }

    static final ExportTable<JournalReader.StoredObservation> OBSERVATIONS = new ExportTable<>("observations", List.of(
            new Column<>("id", JournalReader.StoredObservation::id),
            new Column<>("spread_id", JournalReader.StoredObservation::spreadId),
            new Column<>("market_date", JournalReader.StoredObservation::date),
            new Column<>("value_bp", JournalReader.StoredObservation::valueBp),
            new Column<>("seq", JournalReader.StoredObservation::seq),
            new Column<>("standing", JournalReader.StoredObservation::standing),
            new Column<>("recorded_at", JournalReader.StoredObservation::recordedAt)));

    static final ExportTable<JournalReader.StoredTransition> TRANSITIONS = new ExportTable<>("transitions", List.of(
            new Column<>("id", JournalReader.StoredTransition::id),
            new Column<>("spread_id", JournalReader.StoredTransition::spreadId),
            new Column<>("market_date", JournalReader.StoredTransition::date),
            new Column<>("from_state", JournalReader.StoredTransition::from),
            new Column<>("to_state", JournalReader.StoredTransition::to),
            new Column<>("reason", JournalReader.StoredTransition::reason),
            new Column<>("test", JournalReader.StoredTransition::test),
            new Column<>("window", JournalReader.StoredTransition::window),
            new Column<>("measured", JournalReader.StoredTransition::measured),
            new Column<>("limit", JournalReader.StoredTransition::limit),
            new Column<>("value_bp", JournalReader.StoredTransition::valueBp),
            new Column<>("days_inverted", JournalReader.StoredTransition::daysInverted),
            new Column<>("spell_id", JournalReader.StoredTransition::spellId),
            new Column<>("seq", JournalReader.StoredTransition::seq),
            new Column<>("superseded_by", JournalReader.StoredTransition::supersededBy),
            new Column<>("recorded_at", JournalReader.StoredTransition::recordedAt)));

    static final ExportTable<AlertHistory.StoredAlert> ALERTS = new ExportTable<>("alerts", List.of(
            new Column<>("id", a -> a.alert().id()),
            new Column<>("rule", a -> a.alert().rule()),
            new Column<>("subject", AlertHistory.StoredAlert::subject),
            new Column<>("episode_since", AlertHistory.StoredAlert::episodeSince),
            new Column<>("notice", AlertHistory.StoredAlert::notice),
            new Column<>("kind", a -> a.alert().kind().name()),
            new Column<>("severity", a -> a.alert().severity().name()),
            new Column<>("market_date", a -> a.alert().marketDate()),
            new Column<>("state", a -> a.alert().state()),
            new Column<>("title", a -> a.alert().subject()),
            new Column<>("text", a -> a.alert().text()),
            new Column<>("muted_by", AlertHistory.StoredAlert::mutedBy),
            new Column<>("policy_hash", AlertHistory.StoredAlert::policyHash),
            new Column<>("created_at", a -> a.alert().createdAt()),
            new Column<>("recorded_at", AlertHistory.StoredAlert::recordedAt)));
}

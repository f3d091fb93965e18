package org.slopewatch.pipeline;

import java.util.Collection;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;

/**
 * Which message ids were taken before: the journal is the record (every id is journalled with its
 * quote), and this keeps the most recently used of them in memory, at most {@link #capacity()}, so
 * that memory does not grow with every message ever received. A lookup the memory cannot answer
 * goes to the journal, one query for all the ids of a step, so the answer stays exact however far
 * back the first copy came.
 *
 * <p>Only ids the journal holds are remembered (those it answered with, and those of a step once
 * its transaction has committed), so memory never runs ahead of the journal. Not thread-safe: the
 * pipeline calls it under its lock.
 */
final class SeenIds {

    /** Ids kept in memory unless configured otherwise (the default of {@link IngestConfig#seenIdsCache()}). */
    static final int DEFAULT_CAPACITY = Integer.parseInt(QuotePipeline.Memory.DEFAULT_SEEN_IDS);

    private final int capacity;
    private final Function<Collection<String>, Set<String>> journal;
    private final LinkedHashMap<String, Boolean> recent;

    /**
     * @param capacity the most ids kept in memory, at least 1
     * @param journal  the ids among those given that the journal holds as seen
     */
    SeenIds(int capacity, Function<Collection<String>, Set<String>> journal) {
        if (capacity < 1) {
            throw new IllegalArgumentException(
                    "the seen ids cache (slopewatch.ingest.seen-ids-cache) must hold at least one id, not " + capacity);
        }
        this.capacity = capacity;
        this.journal = journal;
        // access order: a hit makes an id recent again, so a message redelivered over and over stays cheap
        this.recent = new LinkedHashMap<>(16, 0.75f, true) {
            @Override
            protected boolean removeEldestEntry(Map.Entry<String, Boolean> eldest) {
                return size() > SeenIds.this.capacity;
            }
        };
    }

    /**
     * The ids among {@code ids} taken in an earlier step: from memory where it knows them, the rest
     * from the journal in one lookup (none when memory knows them all). Null ids are ignored.
     */
    Set<String> takenBefore(Collection<String> ids) {
        Set<String> taken = new HashSet<>();
        Set<String> unknown = new HashSet<>();
        for (String id : ids) {
            if (id == null) {
                continue;
            }
            if (recent.get(id) != null) {
                taken.add(id);
            } else {
                unknown.add(id);
            }
        }
        if (!unknown.isEmpty()) {
            for (String id : journal.apply(List.copyOf(unknown))) {
                taken.add(id);
                recent.put(id, Boolean.TRUE);
            }
        }
        return taken;
    }

    /** Ids now in the journal (a step's, after its commit): remembered as the most recent. */
    void remember(Collection<String> ids) {
        for (String id : ids) {
            recent.put(id, Boolean.TRUE);
        }
    }

    /** Forgets everything held in memory (the journal still answers for it). */
    void clear() {
        recent.clear();
    }

    /** Ids held in memory now: never more than {@link #capacity()}. */
    int size() {
        return recent.size();
    }

    int capacity() {
        return capacity;
    }
}

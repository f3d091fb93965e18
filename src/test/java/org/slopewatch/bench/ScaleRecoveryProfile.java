package org.slopewatch.bench;

import io.agroal.api.AgroalDataSource;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Locale;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * Where recovery spends its time, in one JVM on a journal {@link ScaleJournalBuilder} wrote:
 * reading and decoding the journal's quotes alone ({@code JournalReader.replayQuotes} into a sink
 * that only counts: the baseline) against the whole of {@code QuotePipeline.recover()} (the same
 * read plus curve book and monitors), alternating, after one warm-up round of each. The
 * difference is what the engine adds to reading. Both in wall time and in the thread's CPU time
 * (H2 embedded runs in the calling thread).
 *
 * <p>Arguments: DIR [ROUNDS]. Not a test (surefire excludes bench/).
 */
public final class ScaleRecoveryProfile {

    /** Thread CPU time as well as wall time: on a shared machine a thread waiting for a core loses wall time, not CPU time. */
    private static final ThreadMXBean CPU = ManagementFactory.getThreadMXBean();

    public static void main(String[] args) throws Exception {
        Path dir = Path.of(args[0]).toAbsolutePath();
        int rounds = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        String url = "jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_ON_EXIT=FALSE";
        try (AgroalDataSource ds = JournalDatabase.open(url, null, null, 4)) {
            JournalReader reader = new JournalReader(ds);
            QuotePipeline pipeline = new QuotePipeline(ScaleScenario.watches(), new JournalWriter(ds, Clock.systemUTC()), reader,
                    PipelineListener.NONE, Clock.systemUTC());
            for (int round = 0; round <= rounds; round++) {
                long[] read = {0};
                long c0 = CPU.getCurrentThreadCpuTime();
                long t0 = System.nanoTime();
                reader.replayQuotes(q -> read[0]++);
                double readSeconds = (System.nanoTime() - t0) / 1e9;
                double readCpu = (CPU.getCurrentThreadCpuTime() - c0) / 1e9;
                long c1 = CPU.getCurrentThreadCpuTime();
                long t1 = System.nanoTime();
                long recovered = pipeline.recover();
                double recoverSeconds = (System.nanoTime() - t1) / 1e9;
                double recoverCpu = (CPU.getCurrentThreadCpuTime() - c1) / 1e9;
                if (recovered != read[0]) {
                    throw new IllegalStateException("read " + read[0] + " messages but recovered " + recovered);
                }
                System.out.printf(Locale.ROOT, "scale-recovery journal=%s round=%s messages=%d read_only_s=%.3f recover_s=%.3f "
                                + "read_only_messages_per_s=%.0f recover_messages_per_s=%.0f recover_over_read=%.2f read_only_cpu_s=%.3f recover_cpu_s=%.3f "
                                + "read_only_messages_per_cpu_s=%.0f recover_messages_per_cpu_s=%.0f recover_over_read_cpu=%.2f load=%s%n",
                        dir.getFileName(), round == 0 ? "warm-up" : Integer.toString(round), recovered, readSeconds, recoverSeconds,
                        read[0] / readSeconds, recovered / recoverSeconds, recoverSeconds / readSeconds, readCpu, recoverCpu,
                        read[0] / readCpu, recovered / recoverCpu, recoverCpu / readCpu, ScaleStartupBench.load());
            }
        }
    }
}

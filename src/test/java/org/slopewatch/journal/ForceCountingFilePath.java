package org.slopewatch.journal;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import org.h2.store.fs.FileBase;
import org.h2.store.fs.FilePath;
import org.h2.store.fs.FilePathWrapper;

/**
 * An H2 file system over the default one ({@code jdbc:h2:forcecount:/dir/name}, H2's pluggable
 * {@code FilePath}, the mechanism of its own {@code split:} and {@code rec:} prefixes) that counts,
 * per file, the writes and the calls of {@link FileChannel#force}: what the operating system was
 * told to put on the disk. A test reads the counts of {@code name.mv.db}.
 */
public final class ForceCountingFilePath extends FilePathWrapper {

    static final String SCHEME = "forcecount";

    /** Writes and fsyncs of one file. */
    static final class Counts {
        final AtomicLong writes = new AtomicLong();
        final AtomicLong forces = new AtomicLong();
        // the writes made before the latest force began: those are on the disk
        final AtomicLong forcedWrites = new AtomicLong();

        /** Writes not yet covered by a force: what a crash of the machine could still lose. */
        long unforced() {
            return writes.get() - forcedWrites.get();
        }
    }

    private static final Map<String, Counts> COUNTS = new ConcurrentHashMap<>();

    static {
        FilePath.register(new ForceCountingFilePath());
    }

    /** H2 makes one instance per path by reflection: a public constructor without arguments. */
    public ForceCountingFilePath() {
    }

    /** The JDBC URL of an H2 database named {@code file} (without {@code .mv.db}) on this file system. */
    static String url(Path file) {
        return "jdbc:h2:" + SCHEME + ":" + file.toAbsolutePath();
    }

    /** The counts of the H2 database named {@code file}'s data file. */
    static Counts of(Path file) {
        return COUNTS.computeIfAbsent(file.toAbsolutePath() + ".mv.db", k -> new Counts());
    }

    @Override
    public String getScheme() {
        return SCHEME;
    }

    @Override
    public FileChannel open(String mode) throws IOException {
        String plain = name.substring(SCHEME.length() + 1);
        return new Counting(super.open(mode), COUNTS.computeIfAbsent(plain, k -> new Counts()));
    }

    /** The channel H2 writes through, delegating everything and counting writes and forces. */
    private static final class Counting extends FileBase {

        private final FileChannel channel;
        private final Counts counts;

        Counting(FileChannel channel, Counts counts) {
            this.channel = channel;
            this.counts = counts;
        }

        @Override
        public void implCloseChannel() throws IOException {
            channel.close();
        }

        @Override
        public long position() throws IOException {
            return channel.position();
        }

        @Override
        public FileChannel position(long pos) throws IOException {
            channel.position(pos);
            return this;
        }

        @Override
        public long size() throws IOException {
            return channel.size();
        }

        @Override
        public int read(ByteBuffer dst) throws IOException {
            return channel.read(dst);
        }

        @Override
        public int read(ByteBuffer dst, long position) throws IOException {
            return channel.read(dst, position);
        }

        @Override
        public int write(ByteBuffer src) throws IOException {
            int n = channel.write(src);
            wrote();
            return n;
        }

        @Override
        public int write(ByteBuffer src, long position) throws IOException {
            int n = channel.write(src, position);
            wrote();
            return n;
        }

        private void wrote() {
            counts.writes.incrementAndGet();
        }

        @Override
        public FileChannel truncate(long size) throws IOException {
            channel.truncate(size);
            return this;
        }

        @Override
        public void force(boolean metaData) throws IOException {
            long before = counts.writes.get();
            channel.force(metaData);
            counts.forces.incrementAndGet();
            counts.forcedWrites.accumulateAndGet(before, Math::max);
        }

        @Override
        public FileLock tryLock(long position, long size, boolean shared) throws IOException {
            return channel.tryLock(position, size, shared);
        }
    }
}

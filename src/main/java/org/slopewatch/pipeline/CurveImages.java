package org.slopewatch.pipeline;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import java.util.TreeSet;
import java.util.zip.CRC32;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.Watch;

/**
 * A curve's in-memory state as a checkpoint's bytes and back: its snapshots held by the curve book
 * and its spreads' tracks, then a CRC-32 of all that, so a damaged row is found before any of it
 * is believed. Written under a fingerprint of the watches in force; a checkpoint of other watches
 * (another policy's spreads or rules) is not read.
 */
final class CurveImages {

    /**
     * The layout of the bytes; a checkpoint of another layout is passed over (its curve rebuilt from
     * its quotes). 2: a track holds its transitions and spells after its base only, which layout 1
     * did not.
     */
    static final int LAYOUT = 2;

    private final String fingerprint;

    CurveImages(List<Watch> watches) {
        this.fingerprint = fingerprint(watches);
    }

    String fingerprint() {
        return fingerprint;
    }

    /** The checkpoint of a curve as it stands, including every quote numbered up to {@code seq}. */
    CurveCheckpoints.Stored image(String curve, long seq, CurveBook book, SignalEngine engine) {
        try {
            ByteArrayOutputStream bytes = new ByteArrayOutputStream(4096);
            DataOutputStream out = new DataOutputStream(bytes);
            out.writeUTF(curve);
            book.writeCurve(curve, out);
            engine.writeCurve(curve, out);
            out.flush();
            CRC32 crc = new CRC32();
            crc.update(bytes.toByteArray());
            out.writeLong(crc.getValue());
            out.flush();
            return new CurveCheckpoints.Stored(curve, seq, fingerprint, LAYOUT, bytes.toByteArray());
        } catch (IOException e) {
            throw new IllegalStateException("cannot write the checkpoint of " + curve + " to memory", e); // a byte array does not fail
        }
    }

    /**
     * Puts a checkpoint's curve back into the book and the engine.
     *
     * @throws IOException when it cannot be used: another layout or watches, damaged bytes; the book
     *                     and the engine then hold nothing of the curve
     */
    void read(CurveCheckpoints.Stored stored, CurveBook book, SignalEngine engine) throws IOException {
        if (stored.layout() != LAYOUT) {
            throw new IOException("layout " + stored.layout() + ", this version reads " + LAYOUT);
        }
        if (!stored.watches().equals(fingerprint)) {
            throw new IOException("written under other watches than the policy's in force");
        }
        byte[] image = stored.image();
        if (image.length < Long.BYTES) {
            throw new IOException("too short to be a checkpoint (" + image.length + " bytes)");
        }
        CRC32 crc = new CRC32();
        crc.update(image, 0, image.length - Long.BYTES);
        DataInputStream tail = new DataInputStream(new ByteArrayInputStream(image, image.length - Long.BYTES, Long.BYTES));
        if (tail.readLong() != crc.getValue()) {
            throw new IOException("damaged: its check sum does not match");
        }
        DataInputStream in = new DataInputStream(new ByteArrayInputStream(Arrays.copyOf(image, image.length - Long.BYTES)));
        try {
            String curve = in.readUTF();
            if (!curve.equals(stored.curve())) {
                throw new IOException("holds curve " + curve + ", stored as " + stored.curve());
            }
            book.readCurve(curve, in);
            engine.readCurve(curve, in);
            if (in.available() != 0) {
                throw new IOException(in.available() + " byte(s) left over");
            }
        } catch (IOException | RuntimeException e) {
            book.forget(stored.curve());
            throw e instanceof IOException io ? io : new IOException(e.toString(), e);
        }
    }

    /**
     * The watches as one canonical text, hashed: the spreads, their rules and their curves (sorted,
     * since a set's order differs from run to run).
     */
    static String fingerprint(List<Watch> watches) {
        StringBuilder text = new StringBuilder();
        for (Watch w : watches) {
            text.append(w.spread()).append('|').append(w.spread().name()).append('|').append(w.rules()).append('|')
                    .append(new TreeSet<>(w.curves())).append('\n');
        }
        try {
            byte[] hash = MessageDigest.getInstance("SHA-256").digest(text.toString().getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(hash);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }
}

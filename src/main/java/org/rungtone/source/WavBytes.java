package org.rungtone.source;

import java.io.EOFException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;

/**
 * The bytes of one WAV file, read by position from any thread: a file through its channel, or standard input
 * held in memory. Its name heads every message about it ("chime.wav: ...", "standard input: ...").
 */
abstract class WavBytes implements AutoCloseable {
    /** The name messages give it: the path as given, or "standard input". */
    final String name;
    /** The short name warnings give it: the file name, or "standard input". */
    final String shortName;

    private WavBytes(String name, String shortName) {
        this.name = name;
        this.shortName = shortName;
    }

    /** A file's bytes through its open channel (closed with this). */
    static WavBytes of(FileChannel channel, String name, String shortName) {
        return new WavBytes(name, shortName) {
            @Override
            long size() throws IOException {
                return channel.size();
            }

            @Override
            int read(ByteBuffer dst, long position) throws IOException {
                return channel.read(dst, position);
            }

            @Override
            public void close() {
                try {
                    channel.close();
                } catch (IOException ignored) {
                    // only read from; a failed close loses nothing
                }
            }
        };
    }

    /** Bytes held in memory, not copied (the caller hands them over). */
    static WavBytes of(byte[] data, String name) {
        return new WavBytes(name, name) {
            @Override
            long size() {
                return data.length;
            }

            @Override
            int read(ByteBuffer dst, long position) {
                if (position >= data.length) {
                    return -1;
                }
                int n = (int) Math.min(dst.remaining(), data.length - position);
                dst.put(data, (int) position, n);
                return n;
            }

            @Override
            public void close() {
                // nothing to release
            }
        };
    }

    /** The size in bytes. */
    abstract long size() throws IOException;

    /** Reads from {@code position} into {@code dst}; -1 at the end, like {@link FileChannel#read(ByteBuffer, long)}. */
    abstract int read(ByteBuffer dst, long position) throws IOException;

    @Override
    public abstract void close();

    /** Fills {@code dst} from {@code position}. */
    void readFully(ByteBuffer dst, long position) throws IOException {
        while (dst.hasRemaining()) {
            if (read(dst, position + dst.position()) < 0) {
                throw new EOFException();
            }
        }
    }
}

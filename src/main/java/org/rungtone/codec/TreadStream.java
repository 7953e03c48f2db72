package org.rungtone.codec;

import java.util.Arrays;
import java.util.Objects;
import org.rungtone.internal.Checks;
import org.rungtone.quantize.Codes;

/**
 * One sound in Tread: the format, the ladder depth it decodes to, the sample rate, the decoder state it starts
 * from and its b-bit codes, one per sample. The code array is copied in and out; {@link #unsafeCodes()}
 * hands it over without copying for read-only loops.
 */
public final class TreadStream {
    private final TreadDecoder decoder;
    private final double sampleRateHz;
    private final TreadState start;
    private final int[] codes;

    private TreadStream(TreadDecoder decoder, double sampleRateHz, TreadState start, int[] codes) {
        this.decoder = decoder;
        this.sampleRateHz = sampleRateHz;
        this.start = start;
        this.codes = codes;
    }

    /**
     * A stream of a copy of {@code codes}.
     *
     * @throws IllegalArgumentException when the start state or a code is out of range, or the rate is not
     *     positive
     * @throws org.rungtone.internal.SettingError when the format cannot decode to {@code ladderBits}
     */
    public static TreadStream of(TreadFormat format, int ladderBits, double sampleRateHz, TreadState start,
            int[] codes) {
        TreadDecoder decoder = new TreadDecoder(format, ladderBits);
        decoder.checkState(Objects.requireNonNull(start, "start"));
        Checks.checkArgument(sampleRateHz > 0, "sample rate must be positive: %s", sampleRateHz);
        int top = (1 << format.codeBits()) - 1;
        int[] copy = codes.clone();
        for (int i = 0; i < copy.length; i++) {
            if (copy[i] < 0 || copy[i] > top) {
                throw new IllegalArgumentException("Tread code " + copy[i] + " at " + i + " is outside 0.." + top);
            }
        }
        return new TreadStream(decoder, sampleRateHz, start, copy);
    }

    /** The format. */
    public TreadFormat format() {
        return decoder.format();
    }

    /** The ladder depth N the stream decodes to. */
    public int ladderBits() {
        return decoder.ladderBits();
    }

    /** The reference decoder of this stream's format and depth. */
    public TreadDecoder decoder() {
        return decoder;
    }

    /** Sample rate in hertz. */
    public double sampleRateHz() {
        return sampleRateHz;
    }

    /** The decoder state before the first code. */
    public TreadState start() {
        return start;
    }

    /** Number of codes (samples). */
    public int length() {
        return codes.length;
    }

    /** A copy of the codes. */
    public int[] codes() {
        return codes.clone();
    }

    /** The internal array, not copied: read-only by contract. */
    public int[] unsafeCodes() {
        return codes;
    }

    /** The ladder codes the decoder puts out. */
    public Codes decoded() {
        return Codes.of(ladderBits(), sampleRateHz, decoder.decode(start, codes));
    }

    /** The decoder state before code {@code index} (the state a loop starting there stores). */
    public TreadState stateAt(int index) {
        return decoder.stateAt(start, codes, index);
    }

    /** Bytes of the packed codes: ceil(length · b / 8). */
    public long streamBytes() {
        return format().streamBytes(codes.length);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof TreadStream s && s.format() == format() && s.ladderBits() == ladderBits()
                && s.sampleRateHz == sampleRateHz && s.start.equals(start) && Arrays.equals(s.codes, codes);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(codes) * 31 + start.hashCode();
    }

    @Override
    public String toString() {
        return "TreadStream[" + codes.length + " x " + format().optionName() + " to " + ladderBits() + " bits, start "
                + start + "]";
    }
}

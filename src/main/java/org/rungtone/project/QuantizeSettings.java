package org.rungtone.project;

import java.util.Optional;
import org.rungtone.codec.TreadFormat;
import org.rungtone.internal.Setting;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * How one sound becomes codes.
 *
 * @param bits DAC bit depth 1..16
 * @param dither dither kind
 * @param shaping error-feedback filter
 * @param seed seed of every random process
 * @param board the levels the real board produces (modelled ladder or measured unit profile), if known
 * @param compensation quantize onto the board's real levels, or emit plain binary codes
 * @param codec the Tread format the codes are stored in, when the storage is a Tread one: the codes are then
 *     what its decoder makes of the encoded stream
 */
public record QuantizeSettings(int bits, Dither dither, ErrorFilter shaping, long seed, Optional<LevelTable> board,
        Compensation compensation, Optional<TreadFormat> codec) {
    /** Validates the bit depth against the board's and the codec's. */
    public QuantizeSettings {
        Setting.BITS.check(bits >= 1 && bits <= 16, "must be 1..16: %d", bits);
        codec.ifPresent(f -> f.checkLadderBits(bits));
        board.ifPresent(t -> {
            if (t.bits() != bits) {
                throw Setting.BITS.problem("the board's level table has %d bits but %s is %d", t.bits(),
                        Setting.BITS.ref(), bits);
            }
        });
    }

    /** True when quantizing onto a board's real levels. */
    public boolean compensate() {
        return compensation.on();
    }
}

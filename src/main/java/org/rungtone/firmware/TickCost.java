package org.rungtone.firmware;

import java.util.Optional;

/**
 * What one tick of an emitted player costs the CPU: the worst-case cycles of the timer interrupt, from the
 * interrupt request to the end of its return, and the glitch window, the cycles from the first port write of
 * a tick to the last. The figures come from a table measured in simulation (simavr, ATmega328P at 16 MHz,
 * avr-gcc 5.4 with {@code -Os}), taken per storage (each Tread format on its own), engine and number of ladder
 * ports as the largest value over the pin maps, code widths and strategies measured, rounded up to a multiple
 * of five (the assembler interrupts of {@link AvrFastTick}, per strategy, and of {@link AvrTreadTick} have
 * their own rows); the simulator
 * test fails when a build measures more than its figure. Only the avr family has figures: the generic player
 * runs in the user's interrupt, and no Cortex-M simulator checks the cortexm one.
 *
 * @param worstCycles the longest tick, in CPU cycles, including the 4-cycle interrupt response
 * @param windowCycles cycles from the first port write of a tick to the last (0 for one port)
 * @param idleOff true when the timer interrupt is off while nothing plays (clip and loop engines)
 */
public record TickCost(int worstCycles, int windowCycles, boolean idleOff) {
    /**
     * Worst cycles per tick for one, two and three ladder ports. Rows: clip, loop, dds and sweep, each for
     * unpacked and then packed samples (the sweep stores no samples: both rows are the same).
     */
    private static final int[][] AVR_CYCLES = {
        {70, 95, 105}, {135, 165, 175},
        {80, 110, 125}, {145, 175, 185},
        {130, 155, 170}, {225, 265, 250},
        {130, 160, 170}, {130, 160, 170},
    };
    /**
     * The assembler interrupt ({@link AvrFastTick}) for one, two and three ports. Rows: clip by shift, clip by
     * table, loop by shift, loop by table.
     */
    private static final int[][] AVR_FAST_CYCLES = {
        {60, 70, 85}, {65, 80, 90},
        {70, 85, 95}, {75, 90, 105},
    };
    /** The assembler interrupt over packed codes of 1..7 bits ({@link AvrPackedTick}); rows as above. */
    private static final int[][] AVR_FAST_PACKED_CYCLES = {
        {110, 120, 130}, {115, 125, 140},
        {110, 120, 130}, {115, 130, 140},
    };
    /**
     * Worst cycles per tick of the Tread stores in the compiled C tick for one, two and three ladder ports.
     * Rows: tread2, tread3 and tread4, each for the clip and then the loop engine. One port holds codes of up
     * to 8 bits (the byte decoder, measured on scatter maps, which {@link AvrTreadTick} leaves to it); two
     * ports are the widest measured (11 bits, the 16-bit decoder); three ports the largest of the measured
     * ones (6 bits in lookup tables; 12 bits scattered, less their extra terms) and of two ports and one more
     * port write (30), since three ports of codes past 8 bits were not measured on their own.
     */
    private static final int[][] AVR_TREAD_CYCLES = {
        {145, 245, 275}, {150, 245, 275},
        {180, 270, 300}, {180, 275, 305},
        {150, 245, 275}, {150, 250, 280},
    };
    /**
     * The assembler interrupt of a Tread store ({@link AvrTreadTick}) of codes up to 8 bits for one, two and
     * three ports, the largest over shift and table and over 6-, 7- and 8-bit codes; rows as
     * {@link #AVR_TREAD_CYCLES}. With more than 65,535 samples the count of codes left takes a third byte.
     */
    private static final int[][] AVR_TREAD_FAST_CYCLES = {
        {115, 130, 140}, {120, 130, 140},
        {125, 140, 150}, {130, 140, 150},
        {115, 130, 140}, {120, 130, 140},
    };
    /**
     * The same for codes of 9 to 12 bits ({@link AvrTreadWideDecode}), over 9 to 12 bits by shift or table;
     * such codes need two ports at least, so the one-port figures are those of two.
     */
    private static final int[][] AVR_TREAD_FAST_WIDE_CODE_CYCLES = {
        {180, 180, 190}, {180, 180, 190},
        {190, 190, 200}, {190, 190, 200},
        {180, 180, 190}, {180, 180, 190},
    };
    /** The third byte of the count (LDS, SBCI, STS), measured. */
    private static final int AVR_TREAD_FAST_WIDE_CYCLES = 5;
    /** Each port past the third (parts with more ports than the ATmega328P): extrapolated, not measured. */
    private static final int AVR_CYCLES_PER_EXTRA_PORT = 25;
    /** Each scatter term past one per port: the largest measured step was 16.2 cycles. */
    private static final int AVR_CYCLES_PER_EXTRA_TERM = 17;
    /** A sweep for a recording chooses each next hold: 13 to 14 cycles more than the sweep, measured. */
    private static final int AVR_CYCLES_RECORDING = 15;

    /** The cost of the plan's player, or empty when there is no measured figure (generic, cortexm). */
    static Optional<TickCost> of(EmitPlan p) {
        if (p.family != TargetFamily.AVR) {
            return Optional.empty();
        }
        int ports = p.pins.ports().size();
        if (p.tread == null && AvrFastTick.applies(p)) {
            int fast = 2 * (p.engine == PlaybackEngine.LOOP ? 1 : 0) + (p.strategy == PinStrategy.TABLE ? 1 : 0);
            int[][] rows = AvrFastTick.packed(p) ? AVR_FAST_PACKED_CYCLES : AVR_FAST_CYCLES;
            return Optional.of(new TickCost(rows[fast][Math.min(ports, 3) - 1]
                    + AVR_CYCLES_PER_EXTRA_PORT * Math.max(0, ports - 3), ports - 1, true));
        }
        int treadRow = p.tread == null ? 0
                : 2 * p.tread.format().ordinal() + (p.engine == PlaybackEngine.LOOP ? 1 : 0);
        if (AvrTreadTick.applies(p)) {
            int[][] rows = p.tread.compact() ? AVR_TREAD_FAST_CYCLES : AVR_TREAD_FAST_WIDE_CODE_CYCLES;
            return Optional.of(new TickCost(rows[treadRow][ports - 1]
                    + (p.wideIndex ? AVR_TREAD_FAST_WIDE_CYCLES : 0), ports - 1, true));
        }
        int[] row = p.tread != null
                ? AVR_TREAD_CYCLES[treadRow]
                : AVR_CYCLES[2 * engineRow(p.engine) + (p.storage == SampleStorage.PACKED ? 1 : 0)];
        int cycles = row[Math.min(ports, 3) - 1] + AVR_CYCLES_PER_EXTRA_PORT * Math.max(0, ports - 3);
        if (p.request.sweep().filter(s -> s.patternSteps() > 0 && p.engine == PlaybackEngine.SWEEP).isPresent()) {
            cycles += AVR_CYCLES_RECORDING;
        }
        if (p.strategy == PinStrategy.SCATTER) {
            cycles += AVR_CYCLES_PER_EXTRA_TERM * (PinCode.termCount(p.pins) - ports);
        }
        // the values are held in registers and written with one OUT each (1 cycle) back to back
        return Optional.of(new TickCost(cycles, ports - 1, p.isClip()));
    }

    private static int engineRow(PlaybackEngine e) {
        switch (e) {
            case CLIP:
                return 0;
            case LOOP:
                return 1;
            case DDS:
                return 2;
            default:
                return 3;
        }
    }

    /** The share of the CPU the ticks take at {@code tickRateHz} with a {@code cpuClockHz} clock, 0..1. */
    public double cpuShare(double cpuClockHz, double tickRateHz) {
        return worstCycles * tickRateHz / cpuClockHz;
    }

    /** The highest tick rate at which the ticks take at most {@code share} (0..1) of a {@code cpuClockHz} CPU. */
    public double maxRateHz(double cpuClockHz, double share) {
        return share * cpuClockHz / worstCycles;
    }
}

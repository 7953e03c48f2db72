package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Which GPIO pin drives which bit of the DAC code: bit i of the code goes to pin {@code pin(i)}, on up to
 * {@value #MAX_PORTS} ports of 8, 16 or 32 bits.
 *
 * <p>Notation (bit 0 first, items separated by commas, spaces allowed around them):
 * <ul>
 *   <li>a pin, the way the part's datasheet names it: P, the port letter and the pin number, {@code PB3};
 *       ports named by number are written with a dot ({@code P1.3} or {@code 1.3}). The short form
 *       {@code B3} is refused with the datasheet form as a hint: {@code D2} reads to many as a board's
 *       silk-screen label, not as the part's pin; a part with one bank of numbered GPIOs (the RP2040) writes
 *       them {@code GPIO3};</li>
 *   <li>a range on one port: {@code PB0-PB5} (bits take PB0, PB1, ... PB5) or descending {@code PB5-PB0};
 *       the second port may be left out: {@code PB0-5}.</li>
 * </ul>
 * Examples: {@code PB0-PB5}, {@code PA3,PA7,PC0,PC1}, {@code PD2-PD7,PB0,PB1}, {@code P1.0-P1.7},
 * {@code GPIO2-GPIO7}.
 *
 * <p>Immutable.
 */
public final class PinMap {
    /** At most this many ports. */
    public static final int MAX_PORTS = 4;
    /** At most this many pins (the widest code). */
    public static final int MAX_PINS = 16;
    /** {@link PinStrategy#AUTO} uses lookup tables up to this many bits, scatter code above. */
    public static final int AUTO_TABLE_MAX_BITS = 10;
    /** A forced {@link PinStrategy#TABLE} is refused above this many bits. */
    public static final int TABLE_MAX_BITS = 12;

    private final int portWidth;
    private final List<Pin> pins;
    private final List<String> ports;

    private PinMap(int portWidth, List<Pin> pins) {
        this.portWidth = portWidth;
        this.pins = List.copyOf(pins);
        TreeSet<String> names = new TreeSet<>(Pin.PORT_ORDER);
        for (Pin p : pins) {
            names.add(p.port());
        }
        this.ports = List.copyOf(names);
    }

    /**
     * A pin map from pins listed bit 0 first.
     *
     * @throws IllegalArgumentException when a pin repeats, is beyond the port width, or there are too many
     *     pins or ports
     */
    public static PinMap of(int portWidth, List<Pin> pins) {
        String text = notation(pins);
        try {
            return parse(text, portWidth);
        } catch (InputError e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
    }

    /**
     * Parses the notation described in the class comment.
     *
     * @param text the pin list as the user wrote it (the value of {@link Setting#PINS})
     * @param portWidth bits per port register: 8, 16 or 32
     * @throws InputError naming the column of the problem: bad syntax, a pin beyond the port width, a pin
     *     listed twice, a range across ports, more than four ports or more than sixteen pins
     */
    public static PinMap parse(String text, int portWidth) {
        Setting.PORT_WIDTH.check(portWidth == 8 || portWidth == 16 || portWidth == 32, "must be 8, 16 or 32: %d",
                portWidth);
        String t = text == null ? "" : text;
        if (t.isBlank()) {
            throw Setting.PINS.error("is empty; list one pin per code bit, bit 0 first, e.g. PB0-PB5 or"
                    + " PA3,PA7,PC0,PC1");
        }
        return new PinMap(portWidth, new PinListParser(t, portWidth).parse());
    }

    /** Bits per port register. */
    public int portWidth() {
        return portWidth;
    }

    /** Number of pins, which is the number of code bits this map drives. */
    public int bits() {
        return pins.size();
    }

    /** The pin of code bit {@code bit}. */
    public Pin pin(int bit) {
        return pins.get(bit);
    }

    /** All pins, bit 0 first. */
    public List<Pin> pins() {
        return pins;
    }

    /** The ports used, in the fixed order the emitted code updates them. */
    public List<String> ports() {
        return ports;
    }

    /** The pins of the map on {@code port}, as a port-register mask. */
    public long mask(String port) {
        long m = 0;
        for (Pin p : pins) {
            if (p.port().equals(port)) {
                m |= 1L << p.pin();
            }
        }
        return m;
    }

    /**
     * The code bits on {@code port} grouped by displacement (pin number minus bit number), in order of
     * displacement: each entry maps a displacement to the mask of code bits that have it. One group per
     * port means one shift suffices.
     */
    public Map<Integer, Long> shiftGroups(String port) {
        Map<Integer, Long> groups = new TreeMap<>();
        for (int bit = 0; bit < pins.size(); bit++) {
            Pin p = pins.get(bit);
            if (p.port().equals(port)) {
                groups.merge(p.pin() - bit, 1L << bit, (a, b) -> a | b);
            }
        }
        return Collections.unmodifiableMap(groups);
    }

    /** True when every port needs only one mask and one shift ({@link PinStrategy#SHIFT} is possible). */
    public boolean shiftable() {
        for (String port : ports) {
            if (shiftGroups(port).size() != 1) {
                return false;
            }
        }
        return true;
    }

    /**
     * The strategy the emitted code uses: the requested one, or for {@link PinStrategy#AUTO} SHIFT when
     * {@link #shiftable()}, else TABLE up to {@value #AUTO_TABLE_MAX_BITS} bits, else SCATTER.
     *
     * @throws InputError when SHIFT is forced on a map that needs more than one shift per port, or TABLE is
     *     forced above {@value #TABLE_MAX_BITS} bits
     */
    public PinStrategy resolve(PinStrategy requested) {
        switch (requested) {
            case SHIFT:
                Setting.PIN_STRATEGY.check(shiftable(), "shift needs the pins of each port in the order and"
                        + " spacing of their code bits (e.g. PB0-PB5); %s needs table or scatter", notation());
                return PinStrategy.SHIFT;
            case TABLE:
                Setting.PIN_STRATEGY.check(bits() <= TABLE_MAX_BITS, "table for %d bits needs %d entries per"
                        + " port; tables stop at %d bits, use scatter", bits(), 1 << bits(), TABLE_MAX_BITS);
                return PinStrategy.TABLE;
            case SCATTER:
                return PinStrategy.SCATTER;
            default:
                if (shiftable()) {
                    return PinStrategy.SHIFT;
                }
                return bits() <= AUTO_TABLE_MAX_BITS ? PinStrategy.TABLE : PinStrategy.SCATTER;
        }
    }

    /** Flash bytes of the lookup tables: ports × 2^N entries × port width / 8. */
    public long tableBytes() {
        return (long) ports.size() * (1L << bits()) * (portWidth / 8);
    }

    /**
     * The port updates that put {@code code} on the pins, one per port in update order.
     *
     * @throws IllegalArgumentException when the code does not fit the map's bits
     */
    public List<PortWrite> encode(int code) {
        Checks.checkArgument(code >= 0 && code < 1 << bits(), "code %d does not fit %d bits", code, bits());
        Map<String, long[]> acc = new LinkedHashMap<>();
        for (String port : ports) {
            acc.put(port, new long[] {0, mask(port)});
        }
        for (int bit = 0; bit < pins.size(); bit++) {
            if ((code >> bit & 1) != 0) {
                Pin p = pins.get(bit);
                acc.get(p.port())[0] |= 1L << p.pin();
            }
        }
        List<PortWrite> out = new ArrayList<>(acc.size());
        acc.forEach((port, vm) -> out.add(new PortWrite(port, vm[0], vm[1])));
        return out;
    }

    /**
     * The code shown by the given port levels (pins outside the map are ignored); the inverse of
     * {@link #encode}.
     *
     * @throws IllegalArgumentException when a port of the map is missing
     */
    public int decode(Map<String, Long> portLevels) {
        int code = 0;
        for (int bit = 0; bit < pins.size(); bit++) {
            Pin p = pins.get(bit);
            Long level = portLevels.get(p.port());
            Checks.checkArgument(level != null, "no level for port %s", p.port());
            if ((level >> p.pin() & 1) != 0) {
                code |= 1 << bit;
            }
        }
        return code;
    }

    /**
     * Checks that the map has one pin per code bit.
     *
     * @throws InputError when the counts differ
     */
    public void requireBits(int codeBits) {
        Setting.PINS.check(codeBits == bits(), "%s lists %d pin%s but the codes have %d bits; list exactly one"
                + " pin per bit, bit 0 first", notation(), bits(), bits() == 1 ? "" : "s", codeBits);
    }

    /** The map in canonical notation: runs of three or more neighbouring pins written as ranges. */
    public String notation() {
        return notation(pins);
    }

    /** One "bit i: pin" entry per bit, for reports and header comments. */
    public List<String> describeBits() {
        List<String> lines = new ArrayList<>();
        for (int bit = 0; bit < pins.size(); bit++) {
            lines.add(String.format(Locale.ROOT, "bit %d%s -> %s", bit,
                    bit == 0 ? " (LSB)" : bit == pins.size() - 1 ? " (MSB)" : "", pins.get(bit).name()));
        }
        return lines;
    }

    private static String notation(List<Pin> pins) {
        StringBuilder b = new StringBuilder();
        int i = 0;
        while (i < pins.size()) {
            int j = i;
            while (j + 1 < pins.size() && pins.get(j + 1).port().equals(pins.get(i).port())
                    && Math.abs(pins.get(j + 1).pin() - pins.get(j).pin()) == 1
                    && (j == i || pins.get(j + 1).pin() - pins.get(j).pin()
                            == pins.get(i + 1).pin() - pins.get(i).pin())) {
                j++;
            }
            if (b.length() > 0) {
                b.append(',');
            }
            if (j - i >= 2) {
                b.append(pins.get(i).name()).append('-').append(pins.get(j).name());
                i = j + 1;
            } else {
                b.append(pins.get(i).name());
                i++;
            }
        }
        return b.toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PinMap m && m.portWidth == portWidth && m.pins.equals(pins);
    }

    @Override
    public int hashCode() {
        return pins.hashCode() * 31 + portWidth;
    }

    @Override
    public String toString() {
        return notation() + " (" + portWidth + "-bit ports)";
    }
}

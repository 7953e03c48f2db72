package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
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
 *       silk-screen label, not as the part's pin;</li>
 *   <li>a range on one port: {@code PB0-PB5} (bits take PB0, PB1, ... PB5) or descending {@code PB5-PB0};
 *       the second port may be left out: {@code PB0-5}.</li>
 * </ul>
 * Examples: {@code PB0-PB5}, {@code PA3,PA7,PC0,PC1}, {@code PD2-PD7,PB0,PB1}, {@code P1.0-P1.7}.
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
        return new Parser(t, portWidth).parse();
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

    /** A one-pass reader of the notation that reports 1-based columns. */
    private static final class Parser {
        /** A port letter written without its P, at the start of an item or a range's end: D2, B0-B5. */
        private static final Pattern SHORT_PIN = Pattern.compile("(^|[,\\s-]\\s*)([A-Za-z])(?=\\d+(?![\\d.]))");

        private final String text;
        private final int portWidth;
        private final List<Pin> pins = new ArrayList<>();
        private final Map<Pin, Integer> bitOf = new LinkedHashMap<>();
        private final List<String> ports = new ArrayList<>();
        private int pos;

        Parser(String text, int portWidth) {
            this.text = text;
            this.portWidth = portWidth;
        }

        PinMap parse() {
            while (true) {
                skipSpaces();
                int itemColumn = pos + 1;
                Pin first = pin();
                skipSpaces();
                if (peek() == '-') {
                    pos++;
                    skipSpaces();
                    int secondColumn = pos + 1;
                    Pin last;
                    if (Character.isDigit(peek()) && !numberedPortAhead()) {
                        last = new Pin(first.port(), pinNumber(first.port(), first.numberedPort(), secondColumn));
                    } else {
                        last = pin();
                    }
                    if (!last.port().equals(first.port())) {
                        throw error("range at column " + itemColumn + " runs from port " + first.port()
                                + " to port " + last.port() + "; a range stays on one port, e.g. "
                                + first.name() + "-" + new Pin(first.port(), portWidth - 1).name() + ","
                                + new Pin(last.port(), 0).name() + "-" + last.name());
                    }
                    int step = last.pin() >= first.pin() ? 1 : -1;
                    for (int p = first.pin(); ; p += step) {
                        add(new Pin(first.port(), p), p == first.pin() ? itemColumn : secondColumn);
                        if (p == last.pin()) {
                            break;
                        }
                    }
                } else {
                    add(first, itemColumn);
                }
                skipSpaces();
                if (pos >= text.length()) {
                    break;
                }
                if (peek() != ',') {
                    throw error("unexpected '" + peek() + "' at column " + (pos + 1)
                            + "; write pins like PB3, ranges like PB0-PB5, separated by commas");
                }
                pos++;
            }
            return new PinMap(portWidth, pins);
        }

        private void add(Pin pin, int column) {
            Integer earlier = bitOf.get(pin);
            if (earlier != null) {
                throw error("pin " + pin.name() + " at column " + column + " is already bit " + earlier
                        + "; each pin may appear once");
            }
            if (!ports.contains(pin.port())) {
                if (ports.size() == MAX_PORTS) {
                    throw error("port " + pin.port() + " at column " + column + " would be a fifth port;"
                            + " at most " + MAX_PORTS + " ports");
                }
                ports.add(pin.port());
            }
            if (pins.size() == MAX_PINS) {
                throw error("pin " + pin.name() + " at column " + column + " is pin " + (MAX_PINS + 1)
                        + "; codes have at most " + MAX_PINS + " bits, one pin each");
            }
            bitOf.put(pin, pins.size());
            pins.add(pin);
        }

        private Pin pin() {
            int column = pos + 1;
            char c = peek();
            boolean p = c == 'P' || c == 'p';
            String port;
            boolean numbered;
            if (p && numberedPortAt(pos + 1)) {
                pos++;
                port = numberedPort();
                numbered = true;
            } else if (Character.isDigit(c) && numberedPortAt(pos)) {
                port = numberedPort();
                numbered = true;
            } else if (p && asciiLetter(peekAt(pos + 1))) {
                port = String.valueOf(Character.toUpperCase(peekAt(pos + 1)));
                pos += 2;
                numbered = false;
            } else if (asciiLetter(c) && Character.isDigit(peekAt(pos + 1))) {
                throw error("write port pins the way the datasheet names them: " + datasheetForm(text));
            } else if (pos >= text.length()) {
                throw error("a pin is missing at the end; write pins like PB3, ranges like PB0-PB5");
            } else {
                throw error("expected a pin such as PB3 or P1.3 at column " + column + ", found '" + c + "'");
            }
            return new Pin(port, pinNumber(port, numbered, column));
        }

        private static boolean asciiLetter(char c) {
            return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z');
        }

        /** The list with a P before every port letter written without one: {@code D2-D7} is PD2-PD7. */
        private static String datasheetForm(String text) {
            Matcher m = SHORT_PIN.matcher(text);
            StringBuilder b = new StringBuilder();
            while (m.find()) {
                m.appendReplacement(b, m.group(1) + "P" + m.group(2).toUpperCase(Locale.ROOT));
            }
            m.appendTail(b);
            return b.toString().trim();
        }

        private int pinNumber(String port, boolean numbered, int column) {
            int start = pos;
            while (Character.isDigit(peek())) {
                pos++;
            }
            if (start == pos) {
                throw error("expected a pin number after port " + (numbered ? port + "." : port) + " at column "
                        + (pos + 1));
            }
            String digits = text.substring(start, pos);
            int n = digits.length() > 3 ? Integer.MAX_VALUE : Integer.parseInt(digits);
            if (n >= portWidth) {
                throw error("pin P" + (numbered ? port + "." : port) + digits + " at column " + column
                        + " is beyond the "
                        + portWidth + "-bit port (pins 0-" + (portWidth - 1) + ")");
            }
            return n;
        }

        private boolean numberedPortAhead() {
            return numberedPortAt(pos);
        }

        private boolean numberedPortAt(int at) {
            int i = at;
            while (Character.isDigit(peekAt(i))) {
                i++;
            }
            return i > at && peekAt(i) == '.';
        }

        private String numberedPort() {
            int start = pos;
            while (Character.isDigit(peek())) {
                pos++;
            }
            String digits = text.substring(start, pos);
            pos++;
            return digits.length() > 3 ? digits : Integer.toString(Integer.parseInt(digits));
        }

        private void skipSpaces() {
            while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
                pos++;
            }
        }

        private char peek() {
            return peekAt(pos);
        }

        private char peekAt(int i) {
            return i < text.length() ? text.charAt(i) : '\0';
        }

        private InputError error(String what) {
            return Setting.PINS.error("'%s': %s", text, what);
        }
    }
}

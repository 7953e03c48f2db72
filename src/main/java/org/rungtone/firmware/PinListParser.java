package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * A one-pass reader of {@link PinMap}'s notation that reports 1-based columns: every item, range and
 * separator is checked as it is read, and the first problem is the error.
 */
final class PinListParser {
    /** A port letter written without its P, at the start of an item or a range's end: D2, B0-B5. */
    private static final Pattern SHORT_PIN = Pattern.compile("(^|[,\\s-]\\s*)([A-Za-z])(?=\\d+(?![\\d.]))");

    private final String text;
    private final int portWidth;
    private final List<Pin> pins = new ArrayList<>();
    private final Map<Pin, Integer> bitOf = new LinkedHashMap<>();
    private final List<String> ports = new ArrayList<>();
    private int pos;

    PinListParser(String text, int portWidth) {
        this.text = text;
        this.portWidth = portWidth;
    }

    /** The pins, bit 0 first. */
    List<Pin> parse() {
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
        return pins;
    }

    private void add(Pin pin, int column) {
        Integer earlier = bitOf.get(pin);
        if (earlier != null) {
            throw error("pin " + pin.name() + " at column " + column + " is already bit " + earlier
                    + "; each pin may appear once");
        }
        if (!ports.contains(pin.port())) {
            if (ports.size() == PinMap.MAX_PORTS) {
                throw error("port " + pin.port() + " at column " + column + " would be a fifth port;"
                        + " at most " + PinMap.MAX_PORTS + " ports");
            }
            ports.add(pin.port());
        }
        if (pins.size() == PinMap.MAX_PINS) {
            throw error("pin " + pin.name() + " at column " + column + " is pin " + (PinMap.MAX_PINS + 1)
                    + "; codes have at most " + PinMap.MAX_PINS + " bits, one pin each");
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
        } else if (bankAt(pos)) {
            pos += Pin.GPIO_BANK.length();
            port = Pin.GPIO_BANK;
            numbered = false;
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

    /** True at {@code GPIO} followed by a digit, in any case: a pin of the GPIO bank. */
    private boolean bankAt(int at) {
        return text.regionMatches(true, at, Pin.GPIO_BANK, 0, Pin.GPIO_BANK.length())
                && Character.isDigit(peekAt(at + Pin.GPIO_BANK.length()));
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
            throw error("pin " + Pin.name(port, digits) + " at column " + column + " is beyond the "
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

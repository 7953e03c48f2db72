package org.rungtone.ladder;

import java.util.List;
import java.util.Locale;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;

/**
 * Writes a ladder as the {@code [ladder]} table of a TOML file that {@link LadderFile} (and {@code --ladder
 * FILE}) reads back to the same description and so to the same levels. Every value is written in schematic
 * notation ({@code "4.7k"}, {@code "3.3V"}) when that reads back to exactly the same number, else as the
 * number itself; each resistor's line carries a comment.
 */
public final class LadderToml {
    private LadderToml() {
    }

    /**
     * The file's text.
     *
     * @param spec the ladder; its own per-part values (an r2r ladder's too) are written as {@code resistors}
     * @param header comment lines for the top of the file, without the leading {@code #}
     * @param partNotes one comment per resistor, in the order of {@link LadderSpec#resistors()}
     */
    public static String text(LadderSpec spec, List<String> header, List<String> partNotes) {
        Checks.checkArgument(partNotes.size() == spec.resistors().size(), "%d notes for %d resistors",
                partNotes.size(), spec.resistors().size());
        StringBuilder b = new StringBuilder();
        for (String line : header) {
            b.append(line.isEmpty() ? "#" : "# " + line).append('\n');
        }
        b.append(header.isEmpty() ? "" : "\n").append("[ladder]\n");
        key(b, "topology", quoted(spec.topology().key()));
        key(b, "bits", Integer.toString(spec.bits()));
        if (!spec.resistors().isEmpty()) {
            b.append("resistors  = [\n");
            for (int i = 0; i < spec.resistors().size(); i++) {
                b.append("    ").append(value(spec.resistors().get(i), "", "ohm")).append(",  # ")
                        .append(partNotes.get(i)).append('\n');
            }
            b.append("]\n");
        }
        key(b, "base_r", value(spec.baseROhms(), "", "ohm"));
        spec.series().ifPresent(s -> key(b, "series", quoted(s.name())));
        key(b, "tolerance", quoted(Units.format(spec.tolerance() * 100, "") + "%"));
        key(b, "logic_high", value(spec.logicHighVolts(), "V", "V"));
        key(b, "logic_low", value(spec.logicLowVolts(), "V", "V"));
        key(b, "pin_r_high", value(spec.pinROhmsHigh(), "", "ohm"));
        key(b, "pin_r_low", value(spec.pinROhmsLow(), "", "ohm"));
        key(b, "load", value(spec.loadOhms(), "", "ohm"));
        String buffer = "{ gain = " + spec.bufferGain() + ", out_min = "
                + value(spec.outMinVolts(), "V", "V") + (spec.outMaxGiven() ? ", out_max = "
                + value(spec.outMaxVolts(), "V", "V") : "") + " }";
        key(b, "buffer", buffer);
        return b.toString();
    }

    private static void key(StringBuilder b, String key, String value) {
        b.append(String.format(Locale.ROOT, "%-10s = %s%n", key, value).replace(System.lineSeparator(), "\n"));
    }

    /** Schematic text in quotes when it reads back exactly, else the number as TOML writes it. */
    static String value(double v, String symbol, String unit) {
        String text = Units.format(v, symbol);
        try {
            if (Double.compare(Units.parse(text, unit), v) == 0) {
                return quoted(text);
            }
        } catch (InputError e) {
            // the short form does not read back: the number follows
        }
        return Double.toString(v);
    }

    private static String quoted(String text) {
        return "\"" + text.replace("\\", "\\\\").replace("\"", "\\\"") + "\"";
    }
}

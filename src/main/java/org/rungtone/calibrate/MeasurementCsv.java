package org.rungtone.calibrate;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.rungtone.internal.InputError;

/**
 * Reads a filled-in measurement file (Apache Commons CSV): either the plan's layout with a header naming a
 * {@code code} column and a {@code measured} (or {@code volts}) column, or headerless rows of
 * {@code code, volts}. Lines starting with {@code #} and anything after a {@code #} are comments; blank lines
 * are skipped. Codes are decimal ({@code 37}), binary ({@code 0b100101}) or hex ({@code 0x25}); readings are
 * volts with an optional unit ({@code 2.613}, {@code 2.613 V}, {@code 612mV}, {@code 850uV}) and always a
 * '.' decimal point. A row with a code and an empty reading marks the code as not measured; several rows
 * of one code are repeated readings. Every problem is one {@link InputError} naming the file and line.
 */
public final class MeasurementCsv {
    /** Files larger than this are refused (a plan of every 16-bit code is far smaller). */
    public static final long MAX_BYTES = 16L << 20;
    /** Readings above this magnitude are refused as implausible (a missing decimal point). */
    public static final double MAX_VOLTS = 1000;
    private static final List<String> READING_COLUMNS = List.of("measured", "measured_volts", "volts", "reading",
            "voltage");
    private static final Pattern CODE = Pattern.compile("0[bB]([01]{1,16})|0[xX]([0-9a-fA-F]{1,4})|(\\d{1,6})");
    private static final Pattern VOLTS = Pattern.compile(
            "([+-]?)(\\d*)(?:\\.(\\d*))?(?:[eE]([+-]?\\d{1,3}))?\\s*(mV|mv|uV|uv|µV|V|v)?");
    private static final Pattern BINARY = Pattern.compile("[01]{1,16}");
    private static final Pattern DECIMAL_COMMA = Pattern.compile("[+-]?\\d+,\\d+.*");
    private static final Pattern CONTROL = Pattern.compile("\\p{Cntrl}");
    // Built once: the format is immutable, and every file is read the same way.
    private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder().setCommentMarker('#')
            .setIgnoreEmptyLines(true).setIgnoreSurroundingSpaces(true).setTrim(true).build();

    private MeasurementCsv() {
    }

    /**
     * How many cells of the measured column of an existing file hold something: 0 for a fresh plan, -1 when the
     * file cannot be read as a plan (then it may hold readings too).
     */
    public static int filledReadings(Path file) {
        try {
            String text = Files.readString(file, StandardCharsets.UTF_8);
            CSVFormat format = CSVFormat.DEFAULT.builder().setCommentMarker('#').setHeader()
                    .setSkipHeaderRecord(true).setIgnoreSurroundingSpaces(true).build();
            int filled = 0;
            try (CSVParser parser = CSVParser.parse(new StringReader(text), format)) {
                if (!parser.getHeaderMap().containsKey("measured")) {
                    return -1;
                }
                for (CSVRecord r : parser) {
                    if (r.isMapped("measured") && r.isSet("measured") && !r.get("measured").isBlank()) {
                        filled++;
                    }
                }
            }
            return filled;
        } catch (IOException | RuntimeException e) {
            return -1;
        }
    }

    /**
     * Reads a measurement file of an N-bit board.
     *
     * @param bitsOrZero the bit depth, or 0 to take it from the width of the file's binary column
     * @throws InputError naming the file and line of the first problem
     */
    public static Measurements read(Path file, int bitsOrZero) {
        String text;
        try {
            long size = Files.size(file);
            if (size > MAX_BYTES) {
                throw new InputError(file + ": " + size + " bytes is too large for a measurement file (at most "
                        + MAX_BYTES + ")");
            }
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT)
                    .decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString();
        } catch (NoSuchFileException e) {
            throw new InputError(file + ": no such file", e);
        } catch (CharacterCodingException e) {
            throw new InputError(file + ": not a text file in UTF-8; save the sheet as CSV (UTF-8)", e);
        } catch (IOException e) {
            throw new InputError(file + ": cannot read (" + e.getMessage() + ")", e);
        }
        return parse(text, file.toString(), bitsOrZero);
    }

    /**
     * Parses measurement text; {@code name} prefixes every message.
     *
     * @param bitsOrZero the bit depth, or 0 to take it from the width of the binary column
     * @throws InputError naming the file and line of the first problem
     */
    public static Measurements parse(String text, String name, int bitsOrZero) {
        return new Parse(text.startsWith("\uFEFF") ? text.substring(1) : text, name).run(bitsOrZero);
    }

    /** One pass over one file. */
    private static final class Parse {
        private final String text;
        private final String name;
        private final int[] lineStarts;
        private final List<Reading> readings = new ArrayList<>();
        private final List<Reading> unmeasured = new ArrayList<>();
        // One matcher of each kind per file, reset for every field, rather than one per field.
        private final Matcher codeMatcher = CODE.matcher("");
        private final Matcher voltsMatcher = VOLTS.matcher("");
        private int bits;
        private int codeCol = 0;
        private int voltsCol = 1;
        private int binaryCol = -1;
        private int width = -1;

        Parse(String text, String name) {
            this.text = text;
            this.name = name;
            int[] starts = new int[16];
            int n = 0;
            starts[n++] = 0;
            for (int i = 0; i < text.length(); i++) {
                if (text.charAt(i) == '\n') {
                    if (n == starts.length) {
                        starts = Arrays.copyOf(starts, 2 * n);
                    }
                    starts[n++] = i + 1;
                }
            }
            lineStarts = Arrays.copyOf(starts, n);
        }

        Measurements run(int bitsOrZero) {
            bits = bitsOrZero;
            boolean first = true;
            try (CSVParser parser = CSVParser.parse(new StringReader(text), FORMAT)) {
                Iterator<CSVRecord> it = parser.iterator();
                while (true) {
                    CSVRecord rec;
                    try {
                        if (!it.hasNext()) {
                            break;
                        }
                        rec = it.next();
                    } catch (UncheckedIOException | IllegalStateException e) {
                        throw new InputError(name + ":" + Math.max(1, parser.getCurrentLineNumber())
                                + ": not valid CSV (a quote left open?); write one reading per line: code, volts",
                                e);
                    }
                    int line = lineOf(rec.getCharacterPosition());
                    List<String> fields = fields(rec);
                    if (allEmpty(fields)) {
                        continue;
                    }
                    if (first) {
                        first = false;
                        if (!codeMatcher.reset(fields.get(0)).matches()) {
                            header(fields, line);
                            continue;
                        }
                        width = 2;
                    }
                    row(fields, line);
                }
            } catch (IOException e) {
                throw new InputError(name + ": cannot read (" + e.getMessage() + ")", e);
            }
            if (readings.isEmpty() && unmeasured.isEmpty()) {
                throw new InputError(name + ": no readings found; write one per line: code, volts (e.g. 37, 2.613)");
            }
            if (bits == 0) {
                throw new InputError(name + ": the bit depth is unknown; give --bits or --ladder (the file has no"
                        + " binary column to tell it)");
            }
            List<Integer> notRead = new ArrayList<>();
            for (Reading r : unmeasured) {
                checkRange(r.code(), r.line());
                notRead.add(r.code());
            }
            for (Reading r : readings) {
                checkRange(r.code(), r.line());
            }
            return Measurements.of(bits, readings, notRead, name);
        }

        /** The fields of a record up to a '#' comment. */
        private static List<String> fields(CSVRecord rec) {
            List<String> out = new ArrayList<>(rec.size());
            for (int i = 0; i < rec.size(); i++) {
                String f = rec.get(i);
                int hash = f.indexOf('#');
                if (hash >= 0) {
                    String before = f.substring(0, hash).trim();
                    if (!before.isEmpty() || out.isEmpty()) {
                        out.add(before);
                    }
                    break;
                }
                out.add(f);
            }
            return out;
        }

        private static boolean allEmpty(List<String> fields) {
            for (String f : fields) {
                if (!f.isEmpty()) {
                    return false;
                }
            }
            return true;
        }

        /**
         * The line a record starts on. Commons CSV reports the position where it began reading the record,
         * before the blank and comment lines it skipped; those are skipped here too.
         */
        private int lineOf(long charPosition) {
            int i = Arrays.binarySearch(lineStarts, (int) Math.min(Integer.MAX_VALUE, charPosition));
            int line = i >= 0 ? i : -i - 2;
            while (line + 1 < lineStarts.length && blankOrComment(lineStarts[line], lineStarts[line + 1])) {
                line++;
            }
            return line + 1;
        }

        /** True when text[from, to) trimmed is empty or starts with '#' (as String.trim, without a copy). */
        private boolean blankOrComment(int from, int to) {
            for (int i = from; i < to; i++) {
                char c = text.charAt(i);
                if (c > ' ') {
                    return c == '#';
                }
            }
            return true;
        }

        private InputError error(int line, String detail) {
            return new InputError(name + ":" + line + ": " + detail);
        }

        private void header(List<String> fields, int line) {
            codeCol = -1;
            voltsCol = -1;
            for (int i = 0; i < fields.size(); i++) {
                String f = fields.get(i).toLowerCase(Locale.ROOT);
                if (f.equals("code") && codeCol < 0) {
                    codeCol = i;
                } else if (f.equals("binary") && binaryCol < 0) {
                    binaryCol = i;
                } else if (READING_COLUMNS.contains(f) && voltsCol < 0) {
                    voltsCol = i;
                }
            }
            if (codeCol < 0 || voltsCol < 0) {
                String hint = fields.size() == 1 && (fields.get(0).contains(";") || fields.get(0).contains("\t"))
                        ? "; separate the fields with commas" : "";
                throw error(line, "the first line is neither a reading nor a header with a 'code' and a"
                        + " 'measured' (or 'volts') column" + hint);
            }
            width = fields.size();
        }

        private void row(List<String> fields, int line) {
            if (fields.size() > width) {
                throw error(line, fields.size() + " fields where " + width + " are expected (" + layout()
                        + "); a decimal comma splits a number in two: write 2.613, not 2,613");
            }
            String codeText = codeCol < fields.size() ? fields.get(codeCol) : "";
            String voltsText = voltsCol < fields.size() ? fields.get(voltsCol) : "";
            if (codeText.isEmpty()) {
                if (voltsText.isEmpty()) {
                    return;
                }
                throw error(line, "a reading without a code; put the code in the " + (codeCol + 1)
                        + ". column");
            }
            int code = code(codeText, line);
            if (binaryCol >= 0 && binaryCol < fields.size() && !fields.get(binaryCol).isEmpty()) {
                checkBinary(fields.get(binaryCol), code, line);
            }
            if (bits != 0) {
                checkRange(code, line);
            }
            if (voltsText.isEmpty()) {
                unmeasured.add(new Reading(code, 0, 0, line));
                return;
            }
            double[] v = volts(voltsText, line);
            readings.add(new Reading(code, v[0], v[1], line));
        }

        private void checkRange(int code, int line) {
            if (code >= 1 << bits) {
                throw error(line, "code " + code + " is outside 0.." + ((1 << bits) - 1) + " for a " + bits
                        + "-bit ladder");
            }
        }

        private String layout() {
            return binaryCol >= 0 || width > 2 ? "the header's columns" : "code, volts";
        }

        private int code(String t, int line) {
            Matcher m = codeMatcher.reset(t);
            if (!m.matches()) {
                String hint = t.contains(";") || t.contains("\t") ? "; separate the fields with commas" : "";
                throw error(line, "'" + shown(t) + "' is not a code; write it in decimal (37), binary"
                        + " (0b100101) or hex (0x25)" + hint);
            }
            if (m.group(1) != null) {
                return Integer.parseInt(m.group(1), 2);
            }
            if (m.group(2) != null) {
                return Integer.parseInt(m.group(2), 16);
            }
            int code = Integer.parseInt(m.group(3));
            if (code > 0xFFFF) {
                throw error(line, "code " + code + " is larger than any 16-bit code");
            }
            return code;
        }

        private void checkBinary(String b, int code, int line) {
            if (!BINARY.matcher(b).matches()) {
                throw error(line, "binary '" + shown(b) + "' is not a row of 0s and 1s");
            }
            int value = Integer.parseInt(b, 2);
            if (value != code) {
                throw error(line, "binary " + b + " is code " + value + " but the code column says " + code
                        + "; correct one of them");
            }
            if (bits == 0) {
                // The plan writes every code with N digits: the first one tells the bit depth.
                bits = b.length();
            }
        }

        private double[] volts(String t, int line) {
            Matcher m = voltsMatcher.reset(t);
            boolean digits = m.matches() && (!m.group(2).isEmpty() || (m.group(3) != null && !m.group(3)
                    .isEmpty()));
            if (!digits) {
                String hint = DECIMAL_COMMA.matcher(t).matches() ? "; use '.' as the decimal point: "
                        + shown(t.replace(',', '.')) : "";
                throw error(line, "'" + shown(t) + "' is not a reading in volts; write 2.613, 2.613 V or 612mV"
                        + hint);
            }
            String mantissa = m.group(1) + (m.group(2).isEmpty() ? "0" : m.group(2))
                    + (m.group(3) == null || m.group(3).isEmpty() ? "" : "." + m.group(3));
            int exp = m.group(4) == null ? 0 : Integer.parseInt(m.group(4));
            int decimals = m.group(3) == null ? 0 : m.group(3).length();
            double scale = unitScale(m.group(5));
            double v = Double.parseDouble(mantissa) * Math.pow(10, exp) * scale;
            if (!Double.isFinite(v) || Math.abs(v) > MAX_VOLTS) {
                throw error(line, "'" + shown(t) + "' is not a plausible reading (more than "
                        + (int) MAX_VOLTS + " V); is a decimal point missing? write 2.613 or 2613mV");
            }
            double step = Math.pow(10, exp - decimals) * scale;
            return new double[] {v, step};
        }

        private static double unitScale(String unit) {
            if (unit == null || unit.equalsIgnoreCase("v")) {
                return 1;
            }
            return unit.startsWith("m") ? 1e-3 : 1e-6;
        }

        /** The text as it may appear inside a one-line message: no control characters, at most 40 chars. */
        private static String shown(String t) {
            String s = CONTROL.matcher(t).replaceAll("?");
            return s.length() > 40 ? s.substring(0, 40) + "..." : s;
        }
    }
}

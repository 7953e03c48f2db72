package org.rungtone.calibrate;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rungtone.internal.InputError;
import org.rungtone.internal.TomlText;
import org.rungtone.ladder.LevelTable;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlPosition;

/** Writes and reads the TOML form of a {@link UnitProfile} (package-private). */
final class UnitProfileFile {
    private static final List<String> TABLES = List.of("unit", "model", "levels");
    private static final List<String> UNIT_KEYS = List.of("board", "date", "bits", "ladder", "readings", "table");
    private static final List<String> MODEL_KEYS = List.of("kind", "offset_volts", "step_volts",
            "numerator_volts", "load", "residual_rms_volts", "meter_step_volts", "outlier_codes");
    private static final int PER_LINE = 8;

    private UnitProfileFile() {
    }

    static String write(UnitProfile p) {
        StringBuilder sb = new StringBuilder();
        sb.append("# Rungtone unit profile: the output level of every code of one built board.\n");
        sb.append("# Use it with: rungtone build SOURCE --unit THIS_FILE (also ladder).\n");
        sb.append("# Volts at the ladder's (buffered) output; lists run bit 0 or code 0 first.\n\n");
        sb.append("[unit]\n");
        sb.append("board = ").append(quote(p.board())).append('\n');
        sb.append("date = \"").append(p.date()).append("\"\n");
        sb.append("bits = ").append(p.bits()).append('\n');
        sb.append("ladder = ").append(quote(p.ladder())).append('\n');
        sb.append("readings = ").append(p.readings()).append('\n');
        sb.append("table = \"").append(p.tableSource().key()).append("\"   # measured: the readings themselves;"
                + " fitted: the model at every code\n");
        if (p.model().isPresent()) {
            BoardModel m = p.model().get();
            sb.append("\n[model]\n");
            sb.append("kind = \"").append(m.key()).append("\"\n");
            if (m instanceof Superposition s) {
                sb.append("# V(code) = offset + the steps of the bits that are high\n");
                sb.append("offset_volts = ").append(v(s.offsetVolts())).append('\n');
                double[] steps = new double[s.bits()];
                for (int i = 0; i < steps.length; i++) {
                    steps[i] = s.stepVolts(i);
                }
                sb.append("step_volts = ").append(list(steps, false)).append('\n');
            } else {
                SwitchedLoad w = (SwitchedLoad) m;
                sb.append("# V(code) = (c + sum of a_i of the high bits) / (1 + sum of d_i of the high bits)\n");
                sb.append("numerator_volts = ").append(list(w.numeratorVolts(), false)).append("   # c, a_0 ..\n");
                sb.append("load = ").append(list(w.loadTerms(), true)).append("   # d_0 ..\n");
            }
            if (Double.isFinite(p.residualRmsVolts())) {
                sb.append("residual_rms_volts = ").append(v(p.residualRmsVolts())).append('\n');
            }
            sb.append("meter_step_volts = ").append(v(p.meterStepVolts())).append('\n');
            sb.append("outlier_codes = ").append(p.outlierCodes()).append('\n');
        }
        sb.append("\n[levels]\nvolts = [\n");
        double[] levels = p.levels().levels();
        for (int k = 0; k < levels.length; k += PER_LINE) {
            sb.append("   ");
            int end = Math.min(levels.length, k + PER_LINE);
            for (int j = k; j < end; j++) {
                sb.append(' ').append(v(levels[j])).append(',');
            }
            sb.append("   # ").append(k).append(end - 1 > k ? ".." + (end - 1) : "").append('\n');
        }
        sb.append("]\n");
        return sb.toString();
    }

    private static String v(double volts) {
        return String.format(Locale.ROOT, "%.9f", volts);
    }

    private static String list(double[] x, boolean exponent) {
        StringBuilder b = new StringBuilder("[");
        for (int i = 0; i < x.length; i++) {
            b.append(i == 0 ? "" : ", ").append(exponent ? String.format(Locale.ROOT, "%.9e", x[i]) : v(x[i]));
        }
        return b.append(']').toString();
    }

    private static String quote(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (char c : s.toCharArray()) {
            if (c == '"' || c == '\\') {
                b.append('\\').append(c);
            } else if (c < 0x20 || c == 0x7f) {
                b.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.append('"').toString();
    }

    static UnitProfile load(Path file) {
        String text;
        try {
            text = Files.readString(org.rungtone.internal.OutputFolder.staged(file), StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw new InputError(file + ": no such file (a unit profile is written by 'rungtone calibrate fit')",
                    e);
        } catch (IOException e) {
            throw new InputError(file + ": cannot read (" + e.getMessage() + ")", e);
        }
        return parse(text, file);
    }

    static UnitProfile parse(String text, Path file) {
        TomlParseResult root = TomlText.parse(text, file,
                e -> new InputError(at(file, e.position()) + ": not valid TOML: " + e.getMessage(), e));
        for (String key : root.keySet()) {
            if (!TABLES.contains(key)) {
                throw new Reader(root, file, text).error(key, "unknown table or key; a unit profile has [unit], [model]"
                        + " and [levels]");
            }
        }
        Reader r = new Reader(root, file, text);
        if (!root.isTable("unit")) {
            throw new InputError(file + ": no [unit] table; is this a unit profile from 'rungtone calibrate fit'?");
        }
        r.known("unit", UNIT_KEYS);
        String board = r.string("unit.board", null);
        if (board.isBlank()) {
            throw r.error("unit.board", "the board name is empty");
        }
        LocalDate date = r.date("unit.date");
        long bits = r.integer("unit.bits", -1);
        if (bits < 1 || bits > 16) {
            throw r.error("unit.bits", "must be 1..16, got " + bits);
        }
        String ladder = r.string("unit.ladder", "");
        long readings = r.integer("unit.readings", 0);
        String table = r.string("unit.table", "fitted");
        UnitProfile.TableSource source;
        if (table.equals("measured")) {
            source = UnitProfile.TableSource.MEASURED;
        } else if (table.equals("fitted")) {
            source = UnitProfile.TableSource.FITTED;
        } else {
            throw r.error("unit.table", "must be \"measured\" or \"fitted\", got \"" + table + "\"");
        }
        if (!root.isTable("levels")) {
            throw new InputError(file + ": no [levels] table with the volts of every code");
        }
        r.known("levels", List.of("volts"));
        double[] volts = r.numbers("levels.volts", 1 << bits, "one level per code, code 0 first");
        UsableLevels.problem(volts).ifPresent(p -> {
            throw r.entryError("levels.volts", p.code(), p.detail());
        });
        Optional<BoardModel> model = Optional.empty();
        double residual = Double.NaN;
        double step = 0;
        List<Integer> outliers = List.of();
        if (root.contains("model")) {
            if (!root.isTable("model")) {
                throw r.error("model", "expected a [model] table");
            }
            r.known("model", MODEL_KEYS);
            model = Optional.of(model(r, (int) bits));
            residual = r.number("model.residual_rms_volts", Double.NaN);
            step = r.number("model.meter_step_volts", 0);
            outliers = r.codes("model.outlier_codes", 1 << bits);
        }
        return new UnitProfile(board, date, ladder, (int) Math.max(0, readings), source, model,
                new UnitProfile.Quality(residual, step, outliers), LevelTable.of((int) bits, volts, "unit"));
    }

    private static BoardModel model(Reader r, int bits) {
        String kind = r.string("model.kind", null);
        if (kind.equals("superposition")) {
            double offset = r.number("model.offset_volts", Double.NaN);
            if (Double.isNaN(offset)) {
                throw r.error("model.kind", "a superposition model needs offset_volts");
            }
            return new Superposition(offset, r.numbers("model.step_volts", bits, "one step per bit, bit 0 first"));
        }
        if (kind.equals("switched-load")) {
            double[] num = r.numbers("model.numerator_volts", bits + 1, "c, then one term per bit");
            double[] d = r.numbers("model.load", bits, "one term per bit, bit 0 first");
            double[] a = java.util.Arrays.copyOfRange(num, 1, num.length);
            return new SwitchedLoad(num[0], a, d);
        }
        throw r.error("model.kind", "must be \"superposition\" or \"switched-load\", got \"" + kind + "\"");
    }

    private static String at(Path file, TomlPosition pos) {
        return pos == null ? file.toString() : file + ":" + pos.line();
    }

    /** Typed access with errors that name the file, the line and the key. */
    private static final class Reader {
        private final TomlParseResult root;
        private final Path file;
        private final String text;

        Reader(TomlParseResult root, Path file, String text) {
            this.root = root;
            this.file = file;
            this.text = text;
        }

        /** "FILE:LINE" of entry {@code index} of a list. */
        private String atEntry(TomlArray a, int index) {
            TomlPosition pos = a.inputPositionOf(index);
            return pos == null ? file.toString() : file + ":" + TomlText.entryLine(text, pos);
        }

        InputError error(String key, String detail) {
            TomlPosition pos = TomlText.positionOf(root, key);
            if (pos == null && key.contains(".")) {
                pos = TomlText.positionOf(root, key.substring(0, key.indexOf('.')));
            }
            return new InputError(at(file, pos) + ": " + key + ": " + detail);
        }

        /** An error about entry {@code index} of the list at {@code key}, at that entry's line. */
        InputError entryError(String key, int index, String detail) {
            return root.get(key) instanceof TomlArray a ? new InputError(atEntry(a, index) + ": " + key + ": "
                    + detail) : error(key, detail);
        }

        void known(String table, List<String> keys) {
            for (String k : root.getTable(table).keySet()) {
                if (!keys.contains(k)) {
                    throw error(table + "." + k, "unknown key; known keys are " + String.join(", ", keys));
                }
            }
        }

        String string(String key, String fallback) {
            Object v = root.get(key);
            if (v == null && fallback != null) {
                return fallback;
            }
            if (!(v instanceof String)) {
                throw error(key, v == null ? "missing" : "expected a string in quotes");
            }
            return (String) v;
        }

        LocalDate date(String key) {
            Object v = root.get(key);
            if (v instanceof LocalDate) {
                return (LocalDate) v;
            }
            if (v instanceof String) {
                try {
                    return LocalDate.parse((String) v);
                } catch (DateTimeParseException e) {
                    throw error(key, "expected a date like \"2026-05-01\", got \"" + v + "\"");
                }
            }
            throw error(key, v == null ? "missing" : "expected a date like \"2026-05-01\"");
        }

        long integer(String key, long fallback) {
            Object v = root.get(key);
            if (v == null && fallback >= 0) {
                return fallback;
            }
            if (!(v instanceof Long)) {
                throw error(key, v == null ? "missing" : "expected a whole number");
            }
            return (Long) v;
        }

        double number(String key, double fallback) {
            Object v = root.get(key);
            if (v == null) {
                return fallback;
            }
            if (!(v instanceof Number) || !Double.isFinite(((Number) v).doubleValue())) {
                throw error(key, "expected a finite number");
            }
            return ((Number) v).doubleValue();
        }

        double[] numbers(String key, int count, String what) {
            Object v = root.get(key);
            if (!(v instanceof TomlArray)) {
                throw error(key, v == null ? "missing: expected a list of " + count + " numbers (" + what + ")"
                        : "expected a list of numbers");
            }
            TomlArray a = (TomlArray) v;
            if (a.size() != count) {
                throw error(key, "expected " + count + " numbers (" + what + "), got " + a.size());
            }
            double[] out = new double[count];
            for (int i = 0; i < count; i++) {
                Object e = a.get(i);
                if (!(e instanceof Number) || !Double.isFinite(((Number) e).doubleValue())) {
                    throw new InputError(atEntry(a, i) + ": " + key + ": entry " + i
                            + " is not a finite number");
                }
                out[i] = ((Number) e).doubleValue();
            }
            return out;
        }

        List<Integer> codes(String key, int size) {
            Object v = root.get(key);
            if (v == null) {
                return List.of();
            }
            if (!(v instanceof TomlArray)) {
                throw error(key, "expected a list of codes");
            }
            TomlArray a = (TomlArray) v;
            List<Integer> out = new ArrayList<>();
            for (int i = 0; i < a.size(); i++) {
                Object e = a.get(i);
                if (!(e instanceof Long) || (Long) e < 0 || (Long) e >= size) {
                    throw new InputError(atEntry(a, i) + ": " + key + ": entry " + i
                            + " is not a code 0.." + (size - 1));
                }
                out.add((int) (long) (Long) e);
            }
            return out;
        }
    }
}

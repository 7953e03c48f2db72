package org.rungtone.project;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.CNames;
import org.rungtone.firmware.FlashAttribute;
import org.rungtone.firmware.PinStrategy;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.TimerKind;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.SettingError;
import org.rungtone.internal.TomlText;
import org.rungtone.ladder.LadderTable;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.tomlj.TomlParseError;
import org.tomlj.TomlParseResult;

/**
 * Reads a project file (TOML): {@code [project]}, {@code [target]}, {@code [ladder]}, {@code [quantize]},
 * {@code [preview]} and one or more {@code [[sound]]} tables. Unknown keys, wrong types and conflicting
 * settings are errors naming the file, the line and the key. Paths are relative to the file's folder.
 */
public final class ProjectFile {
    private ProjectFile() {
    }

    /** True when {@code source} names a project file (.toml) rather than one sound. */
    public static boolean isProjectFile(Path source) {
        return source.getFileName() != null && source.getFileName().toString().toLowerCase(Locale.ROOT)
                .endsWith(".toml");
    }

    /**
     * Reads and checks a project file.
     *
     * @throws InputError naming file, line and key for every problem
     */
    public static Project load(Path file) {
        String text;
        try {
            text = Files.readString(OutputFolder.staged(file));
        } catch (NoSuchFileException e) {
            throw InputError.inFile(file, "no such file", e);
        } catch (CharacterCodingException e) {
            throw InputError.inFile(file, "is not UTF-8 text; save the project file as UTF-8", e);
        } catch (IOException e) {
            throw InputError.inFile(file, "cannot be read (" + e.getMessage() + ")", e);
        }
        return parse(text, file);
    }

    /**
     * Parses project-file text that came from {@code file}.
     *
     * @throws InputError naming file, line and key for every problem
     */
    public static Project parse(String text, Path file) {
        TomlParseResult toml = TomlText.parse(text, file, e -> notToml(file, e));
        Path base = file.toAbsolutePath().getParent();
        TomlFields root = new TomlFields(toml, file, "");
        TomlFields project = root.table("project").orElseThrow(() -> new InputError(file
                + ": a project file needs a [project] table with at least name = \"...\""));
        String name = project.string("name").orElseThrow(() -> project.error("name", "is required, e.g."
                + " name = \"greenhouse\""));
        try {
            CNames.symbol(name);
        } catch (SettingError e) {
            throw project.error("name", e.render(setting -> "the name"));
        }
        Optional<Path> out = project.string("out").map(base::resolve);
        Optional<Path> cOut = project.string("c_out").map(base::resolve);
        Optional<Long> seed = project.integer("seed", Long.MIN_VALUE, Long.MAX_VALUE);
        Optional<Path> unit = project.string("unit").map(base::resolve);
        Optional<Compensation> compensation = project.bool("compensation").map(Compensation::of);
        project.rejectUnknown();

        Project.Target target = target(root.table("target"));
        root.declare("ladder");
        Optional<LadderTable> ladder = root.table("ladder").map(t -> LadderTable.of(t.table(), file));
        Project.Quantize quantize = quantize(root.table("quantize"));
        Project.Preview preview = preview(root.table("preview"));
        List<TomlFields> soundTables = root.tables("sound");
        if (soundTables.isEmpty()) {
            throw new InputError(file + ": the project has no sounds; add one or more [[sound]] tables with"
                    + " name and source");
        }
        List<Project.Sound> sounds = new ArrayList<>();
        Set<String> symbols = new HashSet<>();
        for (int i = 0; i < soundTables.size(); i++) {
            Project.Sound s = sound(soundTables.get(i), i + 1, base);
            String symbol;
            try {
                symbol = CNames.symbol(s.name());
            } catch (SettingError e) {
                throw soundTables.get(i).error("name", e.render(setting -> "the name"));
            }
            if (!symbols.add(symbol)) {
                throw soundTables.get(i).error("name", "'" + s.name() + "' gives the C name '" + symbol
                        + "', which another sound already has");
            }
            sounds.add(s);
        }
        root.rejectUnknown();
        return new Project(file, name, out, cOut, seed, unit, compensation, target, ladder, quantize, preview, sounds);
    }

    private static InputError notToml(Path file, TomlParseError e) {
        return new InputError(file + ":" + e.position().line() + ":" + e.position().column()
                + ": not valid TOML: " + e.getMessage().replaceAll(" \\(line \\d+, column \\d+\\)$", ""), e);
    }

    private static Map<String, Integer> lines(TomlFields f) {
        Map<String, Integer> m = new LinkedHashMap<>();
        for (String k : f.table().keySet()) {
            m.put(k, f.line(k));
        }
        return m;
    }

    private static Project.Target target(Optional<TomlFields> t) {
        if (t.isEmpty()) {
            return new Project.Target(Optional.empty(), java.util.OptionalDouble.empty(), Optional.empty(),
                    Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(),
                    java.util.OptionalDouble.empty(), java.util.OptionalDouble.empty(), Optional.empty(),
                    java.util.OptionalDouble.empty(), Optional.empty(), Map.of());
        }
        TomlFields f = t.get();
        Project.Target r = new Project.Target(f.choice("family", "generic", "avr", "cortexm", "rp2040"),
                f.quantity("cpu_clock", "Hz"), f.parsed("timer", TimerKind::parse), f.string("pins"),
                f.integer("port_width", 8, 32),
                f.choice("pin_strategy", "auto", "shift", "table", "scatter").map(PinStrategy::parse),
                f.choice("storage", "unpacked", "packed", "tread2", "tread3", "tread4").map(SampleStorage::parse),
                f.choice("engine", "clip", "loop", "dds").map(PlaybackEngine::parse),
                f.quantity("rate_tolerance", ""), bytes(f, "flash_budget"),
                f.parsed("flash_attr", FlashAttribute::check),
                f.quantity("dds_frequency", "Hz"), f.integer("dds_phase_bits", 8, 32), lines(f));
        f.rejectUnknown();
        if (r.flashAttr().isPresent() && (r.family().isPresent() || r.pins().isPresent())) {
            throw f.error("flash_attr", "applies only to bare sample arrays; a player's family places its"
                    + " tables in flash itself (remove flash_attr or family/pins)");
        }
        return r;
    }

    private static java.util.OptionalDouble bytes(TomlFields f, String key) {
        java.util.OptionalDouble v = f.quantity(key, "");
        if (v.isPresent() && !(v.getAsDouble() > 0)) {
            throw f.error(key, "must be a positive number of bytes, e.g. \"28k\"");
        }
        return v;
    }

    private static Project.Quantize quantize(Optional<TomlFields> t) {
        if (t.isEmpty()) {
            return new Project.Quantize(Optional.empty(), java.util.OptionalDouble.empty(), Optional.empty(),
                    Optional.empty(), Optional.empty(), Map.of());
        }
        TomlFields f = t.get();
        Project.Quantize q = new Project.Quantize(f.integer("bits", 1, 16), f.quantity("rate", "Hz"),
                f.choice("dither", "none", "rpdf", "tpdf").map(d -> Dither.valueOf(d.toUpperCase(Locale.ROOT))),
                f.choice("shaping", "none", "first", "second").map(ErrorFilter::parse),
                f.choice("span", "full", "nominal").map(OutputSpan::parse), lines(f));
        f.rejectUnknown();
        return q;
    }

    private static Project.Preview preview(Optional<TomlFields> t) {
        if (t.isEmpty()) {
            return new Project.Preview(Optional.empty(), java.util.OptionalDouble.empty());
        }
        TomlFields f = t.get();
        Optional<org.rungtone.analysis.ReconstructionFilter> filter = f.string("filter").map(text -> {
            try {
                return org.rungtone.analysis.ReconstructionFilter.parse(text);
            } catch (InputError e) {
                throw f.error("filter", e.getMessage());
            }
        });
        java.util.OptionalDouble rate = f.quantity("rate", "Hz");
        f.rejectUnknown();
        if (rate.isPresent() && rate.getAsDouble() != 44_100 && rate.getAsDouble() != 48_000) {
            throw f.error("rate", "must be \"44.1k\" or \"48k\"");
        }
        return new Project.Preview(filter, rate);
    }

    private static Project.Sound sound(TomlFields f, int index, Path base) {
        String name = f.string("name").orElseThrow(() -> f.error("name", "is required, e.g. name = \"door_chime\""));
        String source = f.string("source").orElseThrow(() -> f.error("source", "is required: a .wav file or"
                + " .rung script, relative to the project file"));
        Optional<LoopSpan> loop = f.parsed("loop", LoopSpan::parse);
        Project.Sound s = new Project.Sound(index, f.line("name"), name, base.resolve(source),
                f.quantity("rate", "Hz"), loop, f.integer("channel", 0, 8), f.decibels("gain"),
                f.decibels("normalize"), f.decibels("trim"), f.quantity("fade_in", "s"), f.quantity("fade_out", "s"),
                f.bool("keep_dc"), f.choice("resampler", "kaiser", "tarsos").map(ResamplerKind::parse), lines(f));
        f.rejectUnknown();
        if (s.gainDb().isPresent() && s.normalizeDbfs().isPresent()) {
            throw f.error("gain", "conflicts with normalize (line " + f.line("normalize") + "); keep one");
        }
        return s;
    }
}

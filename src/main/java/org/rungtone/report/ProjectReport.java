package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.analysis.QualityReport;
import org.rungtone.firmware.FirmwareFacts;
import org.rungtone.internal.FileNames;

/** The report of a whole project: effective settings, every sound's figures, firmware and total flash. */
public final class ProjectReport {
    private ProjectReport() {
    }

    /**
     * What the report shows.
     *
     * @param toolVersion Rungtone version
     * @param file the project file
     * @param name the project name
     * @param settings effective settings with where each came from
     * @param sounds one summary per sound
     * @param firmware firmware report lines
     * @param flashBytes total flash
     * @param flashBudgetBytes budget, 0 for none
     * @param files every file written
     * @param warnings project-level warnings
     * @param firmwareFacts the player's facts, when one player was emitted for all sounds
     * @param outDir the project's output folder, which the JSON report's paths are relative to
     */
    public record Input(String toolVersion, Path file, String name, Map<String, ProjectSetting> settings,
            List<BuildSummary> sounds, List<String> firmware, long flashBytes, long flashBudgetBytes,
            List<Path> files, List<String> warnings, Optional<FirmwareFacts> firmwareFacts, Path outDir) {
    }

    private static String f1(double v) {
        return FigureText.f1(v);
    }

    /** The text report. */
    public static String text(Input in) {
        StringBuilder b = new StringBuilder();
        b.append("Rungtone ").append(in.toolVersion()).append(" project report: ").append(in.name())
                .append("  (").append(in.file().getFileName()).append(")\n\nEffective settings:\n");
        TextTable s = new TextTable("setting", "value");
        ProjectSetting.texts(in.settings()).forEach(s::row);
        b.append(s.render("  "));
        b.append("\nSounds (quantization-only figures of the case the C files hold, and what the listener gets):\n");
        TextTable t = new TextTable("sound", "source", "rate", "samples", "seconds", "case", "SINAD dB",
                "A-wtd SNR dB", FigureText.ENOB_FULL_SCALE, FigureText.LISTENER_SNR + " dB");
        for (BuildSummary x : in.sounds()) {
            QualityReport q = x.emitted();
            t.row(x.symbol(), FileNames.display(x.source()), String.format(Locale.ROOT, "%.0f", x.rateHz()),
                    x.samples(), String.format(Locale.ROOT, "%.3f", x.durationSeconds()), q.label(),
                    f1(q.sinadDb()), f1(q.aWeightedSnrDb()), FigureText.f2(q.enobFullScaleBits()),
                    q.listener().map(l -> f1(l.snrDb())).orElse("-"));
        }
        b.append(t.render("  "));
        for (BuildSummary x : in.sounds()) {
            x.autoLoop().ifPresent(l -> b.append("  ").append(x.symbol()).append(" loop (found): ")
                    .append(LoopFigures.line(l, x.rateHz())).append('\n'));
        }
        for (BuildSummary x : in.sounds()) {
            if (x.quality().size() > 1) {
                b.append("\n").append(x.symbol()).append(" on the board:\n");
                TextTable q = new TextTable("case", "SINAD dB", "in-band SNR dB", "A-wtd SNR dB",
                        FigureText.ENOB_FULL_SCALE, FigureText.ENOB_SIGNAL);
                for (QualityReport r : x.quality()) {
                    q.row(r.label(), f1(r.sinadDb()), f1(r.inBandSnrDb()), f1(r.aWeightedSnrDb()),
                            FigureText.f2(r.enobFullScaleBits()), FigureText.f2(r.enobSignalBits()));
                }
                b.append(q.render("  "));
            }
        }
        b.append("\nDefinitions:\n");
        for (String line : FigureText.definitions()) {
            b.append("  ").append(line).append('\n');
        }
        b.append(String.format(Locale.ROOT, "%nFlash: %,d bytes for all sounds%s%n", in.flashBytes(),
                in.flashBudgetBytes() > 0 ? String.format(Locale.ROOT, " of a %,d-byte budget (%s)",
                        in.flashBudgetBytes(), FigureText.budgetShare(in.flashBytes(), in.flashBudgetBytes())) : ""));
        if (!in.firmware().isEmpty()) {
            b.append("\nFirmware:\n");
            for (String line : in.firmware()) {
                b.append("  ").append(line).append('\n');
            }
        }
        b.append("\nFiles:\n");
        for (Path f : in.files()) {
            b.append("  ").append(f).append('\n');
        }
        List<String> warnings = warnings(in);
        if (!warnings.isEmpty()) {
            b.append("\nWarnings:\n");
            for (String w : warnings) {
                b.append("  - ").append(w).append('\n');
            }
        }
        return b.toString();
    }

    /** The project-level warnings only (each sound's own are shown with the sound). */
    public static List<String> warningsOf(Input in) {
        return List.copyOf(in.warnings());
    }

    /** Project warnings and each sound's warnings, prefixed with the sound. */
    static List<String> warnings(Input in) {
        List<String> w = new ArrayList<>(in.warnings());
        for (BuildSummary x : in.sounds()) {
            for (String s : x.warnings()) {
                w.add(x.symbol() + ": " + s);
            }
        }
        return w;
    }

    /**
     * The JSON report ({@code docs/schema/project.schema.json}): the project's fields, each setting's value and
     * origin, and each sound's build fields under "sounds"; paths are relative to the project's output folder.
     */
    public static Map<String, Object> json(Input in) {
        return ProjectJson.of(in);
    }
}

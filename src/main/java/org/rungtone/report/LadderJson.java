package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.internal.Warning;
import org.rungtone.ladder.DesignProposal;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.Linearity;
import org.rungtone.ladder.MonteCarloResult;
import org.rungtone.ladder.Part;
import org.rungtone.ladder.PartChoice;
import org.rungtone.ladder.PinCurrent;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Stats;

/**
 * The ladder report for machines ({@code docs/schema/ladder.schema.json}): insertion-ordered maps with units
 * in the key names; paths relative to the output folder.
 */
final class LadderJson {
    private LadderJson() {
    }

    /** The whole report: the ladder, wiring, levels, linearity, pin currents, and what else was studied. */
    static Map<String, Object> of(LadderStudy study, List<String> files, Path outDir, String toolVersion) {
        LadderAnalysis a = study.analysis();
        List<String> pins = study.pinNames();
        Map<String, Object> root = Json.header("ladder", toolVersion);
        root.put("ladder", description(a.spec()));
        List<Map<String, Object>> wiring = new ArrayList<>();
        for (Part p : a.ladder().parts()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("part", p.label());
            m.put("bit", p.bit());
            m.put("pin", p.role() == Part.Role.LEG ? pins.get(p.bit()) : null);
            m.put("resistance_ohm", p.ohms());
            wiring.add(m);
        }
        root.put("wiring", wiring);
        root.put("levels_v", a.levels().levels());
        root.put("ideal_v", a.ideal().levels());
        root.put("linearity", linearity(a.linearity()));
        Map<String, Object> outOhm = new LinkedHashMap<>();
        outOhm.put("min", a.minOutputOhms());
        outOhm.put("max", a.maxOutputOhms());
        root.put("output_resistance_ohm", outOhm);
        root.put("pin_limit_a", a.pinLimitAmps());
        root.put("pin_currents", pinCurrents(a.pinCurrents(), pins));
        root.put("monte_carlo", study.monteCarlo().map(LadderJson::monteCarlo).orElse(null));
        root.put("design", study.design().map(d -> design(a.spec(), d.proposal(), d.analysis())).orElse(null));
        root.put("warnings", Warning.texts(a.warnings()));
        root.put("files", files.stream().map(f -> Json.path(Path.of(f), outDir)).toList());
        return root;
    }

    /** A ladder description as the ladder TOML states it; a load of none (open circuit) is null. */
    static Map<String, Object> description(LadderSpec s) {
        Map<String, Object> desc = new LinkedHashMap<>();
        desc.put("topology", s.topology().key());
        desc.put("bits", s.bits());
        desc.put("series", s.series().map(Enum::name).orElse(null));
        desc.put("tolerance_fraction", s.tolerance());
        desc.put("logic_high_v", s.logicHighVolts());
        desc.put("logic_low_v", s.logicLowVolts());
        desc.put("pin_r_high_ohm", s.pinROhmsHigh());
        desc.put("pin_r_low_ohm", s.pinROhmsLow());
        desc.put("load_ohm", s.loadOhms());
        Map<String, Object> buffer = new LinkedHashMap<>();
        buffer.put("gain", s.buffer().gain());
        buffer.put("out_min_v", s.buffer().outMinVolts());
        buffer.put("out_max_v", s.buffer().outMaxVolts());
        desc.put("buffer", buffer);
        return desc;
    }

    private static Map<String, Object> linearity(Linearity lin) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("lsb_v", lin.lsbVolts());
        m.put("ideal_lsb_v", lin.idealLsbVolts());
        m.put("offset_error_v", lin.offsetErrorVolts());
        m.put("offset_error_lsb", lin.offsetErrorLsb());
        m.put("gain_error_percent", lin.gainErrorPercent());
        m.put("gain_error_lsb", lin.gainErrorLsb());
        m.put("worst_dnl_lsb", lin.dnlLsb(lin.worstDnlCode()));
        m.put("worst_dnl_code", lin.worstDnlCode());
        m.put("worst_inl_lsb", lin.inlLsb(lin.worstInlCode()));
        m.put("worst_inl_code", lin.worstInlCode());
        m.put("worst_inl_best_fit_lsb", lin.inlBestFitLsb(lin.worstInlBestFitCode()));
        m.put("worst_inl_best_fit_code", lin.worstInlBestFitCode());
        m.put("monotonic", lin.isMonotonic());
        m.put("inverted_steps", lin.invertedSteps());
        return m;
    }

    /** Pin currents as a list of maps, bit 0 first. */
    private static List<Map<String, Object>> pinCurrents(List<PinCurrent> pins, List<String> names) {
        List<Map<String, Object>> out = new ArrayList<>();
        for (PinCurrent p : pins) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("bit", p.bit());
            m.put("pin", names.get(p.bit()));
            m.put("peak_source_current_a", p.sourceAmps());
            m.put("peak_source_code", p.sourceCode());
            m.put("peak_sink_current_a", p.sinkAmps());
            m.put("peak_sink_code", p.sinkCode());
            out.add(m);
        }
        return out;
    }

    private static Map<String, Object> monteCarlo(MonteCarloResult mc) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("boards", mc.boards());
        m.put("seed", mc.seed());
        Map<String, Object> spread = new LinkedHashMap<>();
        spread.put("distribution", mc.spread().kind().name().toLowerCase(Locale.ROOT));
        spread.put("tolerance_fraction", mc.tolerance());
        spread.put("sigma_fraction", mc.spread().kind() == Spread.Kind.GAUSSIAN ? mc.spread().sigma() : null);
        spread.put("description", mc.spread().describe(mc.tolerance()));
        m.put("spread", spread);
        m.put("worst_dnl_lsb", stats(mc.worstDnlStats()));
        m.put("worst_inl_lsb", stats(mc.worstInlStats()));
        m.put("worst_inl_best_fit_lsb", stats(mc.worstInlBestFitStats()));
        m.put("sinad_db", stats(mc.sinadStats()));
        m.put("enob_full_scale_bits", stats(mc.enobStats()));
        m.put("monotonic_fraction", mc.monotonicFraction());
        m.put("monotonic_interval_95", mc.monotonicInterval95());
        m.put("nominal_sinad_db", mc.nominalSinadDb());
        return m;
    }

    /** Summary statistics: mean, spread and the percentiles. */
    private static Map<String, Object> stats(Stats s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("mean", s.mean());
        m.put("std_dev", s.stdDev());
        m.put("min", s.min());
        m.put("p01", s.p01());
        m.put("p10", s.p10());
        m.put("p50", s.p50());
        m.put("p90", s.p90());
        m.put("p99", s.p99());
        m.put("max", s.max());
        return m;
    }

    private static Map<String, Object> design(LadderSpec s, DesignProposal d, LadderAnalysis proposed) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("series", d.series().name());
        List<Map<String, Object>> parts = new ArrayList<>();
        for (int i = 0; i < s.parts().size(); i++) {
            Map<String, Object> p = new LinkedHashMap<>();
            p.put("part", s.parts().get(i).label());
            p.put("ideal_ohm", d.idealOhms().get(i));
            p.put("nearest", choice(d.naive().get(i)));
            p.put("proposal", choice(d.proposed().get(i)));
            parts.add(p);
        }
        m.put("parts", parts);
        m.put("nearest_worst_inl_lsb", d.naiveLinearity().maxAbsInlLsb());
        m.put("nearest_worst_dnl_lsb", d.naiveLinearity().maxAbsDnlLsb());
        m.put("proposal_worst_inl_lsb", d.proposedLinearity().maxAbsInlLsb());
        m.put("proposal_worst_dnl_lsb", d.proposedLinearity().maxAbsDnlLsb());
        m.put("proposal_monotonic", d.proposedLinearity().isMonotonic());
        m.put("proposal_resistors", d.partCount());
        m.put("proposal_warnings", Warning.texts(proposed.warnings()));
        return m;
    }

    /** A part choice: how its resistors are joined, their values and the resulting resistance. */
    private static Map<String, Object> choice(PartChoice c) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("wiring", c.kind().name().toLowerCase(Locale.ROOT));
        m.put("resistors_ohm", c.kind() == PartChoice.Kind.SINGLE ? List.of(c.first())
                : List.of(c.first(), c.second()));
        m.put("resistance_ohm", c.ohms());
        m.put("description", c.describe());
        return m;
    }
}

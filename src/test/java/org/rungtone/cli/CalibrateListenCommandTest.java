package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonParser;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.calibrate.SyntheticRecording;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.testing.Cli;

/**
 * The whole loop with a sound card: the plan for a recording (its checklist and its sweep), a synthetic
 * recording of a drawn board playing that sweep, and 'calibrate listen' writing the profile, the steps and
 * the plot; and the plan for a meter of known count.
 */
class CalibrateListenCommandTest {
    private static final String[] LADDER = {"--topology", "weighted", "--bits", "8", "--tolerance", "5%"};

    @TempDir
    Path dir;

    private static String[] args(String[] ladder, String... rest) {
        List<String> out = new ArrayList<>(List.of(rest));
        out.addAll(List.of(ladder));
        return out.toArray(new String[0]);
    }

    private static Cli.Run ok(String... args) {
        Cli.Run r = Cli.run(args);
        assertEquals(0, r.exitCode(), r.err() + r.out());
        return r;
    }

    @Test
    void planForARecordingSaysHowToConnectAndWhatNeverTo() throws IOException {
        Cli.Run r = ok(args(LADDER, "calibrate", "plan", "--recording", "--pins", "PB0-PB7", "--out", dir.toString()));
        String out = r.out();
        assertTrue(out.startsWith("Calibration plan for a recording: weighted 8-bit, 5% parts, 256 codes (every code:"
                + " the recorded levels will be the profile)\n"), out);
        assertFalse(out.contains("write each reading"), "no meter readings to write");
        // 5 V into 4.7k of 51.7k: 0.4545 V
        assertTrue(out.contains("Divide it: 47k from the board's output to the input's tip, 4.7k from the tip to"
                + " ground"), out);
        assertTrue(out.contains("the full swing arrives as about 454.5mV"), out);
        assertTrue(out.contains("The sweep: a start pattern (620ms), every code from 0 to 255, each held 40 ms, with 15"
                + " returns to\n  code 0 among them, an end pattern (620ms): 12.08s in all."), out);
        assertTrue(out.contains("! Never connect a speaker amplifier's output"), out);
        assertTrue(out.contains("! Never connect equipment referenced to the mains"), out);
        assertTrue(out.contains("sweep: 271 steps at 1 kHz ticks, each held 40 ms (40 ticks), between a start and"
                + " an end pattern of 31 steps of 20 ticks for a recording"), out);
        String header = Files.readString(dir.resolve("sweep.h"));
        assertTrue(header.contains("#define SWEEP_PATTERN_STEPS 31u"), header);
        assertTrue(header.contains("#define SWEEP_STEP_COUNT 333u"), header);
    }

    @Test
    void listenFitsARecordingIntoTheProfileFitWouldWrite() throws IOException {
        LadderSpec spec = LadderSpec.builder().topology(Topology.WEIGHTED).bits(8).tolerance(0.05).build();
        double[] truth = SimulatedBoard.draw(spec, Spread.uniform(), 12).levels().levels();
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(spec.levels()), 0.040);
        Path wav = SyntheticRecording.wav(dir.resolve("bench.wav"), SyntheticRecording.record(sweep, truth,
                SyntheticRecording.card(48_000, 0.5, 5.6e-5, 0.8, 0.5)), 48_000);
        Path out = dir.resolve("cal");
        Cli.Run r = ok(args(LADDER, "calibrate", "listen", wav.toString(), "--board", "bench", "--date", "2026-05-01",
                "--full-scale-reading", String.format(java.util.Locale.ROOT, "%.4f", truth[255]), "--out",
                out.toString()));
        assertTrue(r.out().contains("clocks: a board tick lasts +100.0 ppm"), r.out());
        assertTrue(r.out().contains("input: high-pass corner 4.0"), r.out());
        assertTrue(r.out().contains("Profile: board bench, 2026-05-01; the readings of every code"), r.out());
        UnitProfile p = UnitProfile.load(out.resolve("bench.unit.toml"));
        assertEquals(UnitProfile.TableSource.MEASURED, p.tableSource());
        double lsb = truth[255] / 255;
        for (int k = 0; k < 256; k++) {
            // code 0 of a ladder to ground is 0 V; the all-ones code is read to 0.1 mV
            assertEquals(truth[k], p.levels().volts(k), 0.05 * lsb + 1e-4, "code " + k);
        }
        for (String f : List.of("fit-residuals.csv", "recording-steps.csv", "recording.png")) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        Cli.Run json = ok(args(LADDER, "calibrate", "listen", wav.toString(), "--board", "bench", "--date",
                "2026-05-01", "--out", out.toString(), "--json"));
        double ppm = JsonParser.parseString(json.out()).getAsJsonObject().getAsJsonObject("recording")
                .get("clock_mismatch_ppm").getAsDouble();
        assertEquals(100, ppm, 0.5, "the card's clock: 100 ppm");
    }

    @Test
    void planForAThreeAndAHalfDigitMeterPutsMostChecksOnItsFineRanges() throws IOException {
        String[] ten = {"--topology", "weighted", "--bits", "10", "--tolerance", "5%"};
        Cli.Run r = ok(args(ten, "calibrate", "plan", "--meter-counts", "2000", "--out", dir.toString()));
        assertTrue(r.out().contains("32 codes to measure"), r.out());
        assertTrue(r.out().contains("The codes for a 2000-count autoranging meter\n  It reads 8 codes on its 200mV"
                + " range (100µV steps), 12 codes on its 2V range (1mV steps), 12 codes"), r.out());
        assertEquals(32, MeasurementCsv.read(dir.resolve("plan.csv"), 10).unmeasured().size());
    }
}

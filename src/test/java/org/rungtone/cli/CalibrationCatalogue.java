package org.rungtone.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.calibrate.SyntheticRecording;
import org.rungtone.cli.BadInputCatalogueTest.Case;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;
import org.rungtone.testing.WavFixtures;
import org.rungtone.testing.WavFixtures.Layout;

/**
 * The bad-input cases of the calibration by recording and by a meter of known count, for
 * {@link BadInputCatalogueTest}: recordings a fit cannot use, a meter count that is not one, readings finer
 * than the resolution given, a recording plan stepped by a button.
 */
final class CalibrationCatalogue {
    /** The ladder of every recording case: 4 bits, so a recording of every code lasts about 2 s. */
    private static final String[] LADDER = {"--topology", "r2r", "--tolerance", "1%"};
    private static final LadderSpec SPEC = LadderSpec.builder().topology(Topology.R2R).bits(4).tolerance(0.01)
            .build();

    private CalibrationCatalogue() {
    }

    private static Case bad(String name, String message, BadInputCatalogueTest.Setup setup) {
        return new Case(name, 1, message, setup);
    }

    /** Adds the cases to {@code c}. */
    static void add(List<Case> c) {
        c.add(bad("calibrate listen: clipped recording", "clipped.wav: the recording clips at 0.50 s (samples at full"
                + " scale)", d -> listen(d, recording(d, "clipped.wav", 1.3, 0.4, 0.3))));
        c.add(bad("calibrate listen: recording too quiet", "quiet.wav: the recording is too quiet: its peak is",
                d -> listen(d, recording(d, "quiet.wav", 0.001, 0.4, 0.3))));
        c.add(bad("calibrate listen: recording shorter than the sweep", "short.wav: the recording is 1.00 s long,"
                + " shorter than the sweep of this plan (1.88 s)", d -> listen(d, cut(recording(d, "short.wav",
                        0.5, 0.4, 0.3), 48_000))));
        c.add(bad("calibrate listen: another hold", "hold.wav: the recording is of another sweep: its codes take"
                + " 0.64 s between the patterns, this plan's 16 codes held 50 ms take 0.80 s",
                d -> listen(d, recording(d, "hold.wav", 0.5, 0.4, 1.0), "--hold", "50ms")));
        c.add(bad("calibrate listen: another step count", "count.wav: the recording is of another sweep: its codes"
                + " take 0.64 s between the patterns, this plan's 32 codes held 40 ms take 1.32 s",
                d -> listen(d, recording(d, "count.wav", 0.5, 0.4, 1.0), "--bits", "5")));
        c.add(bad("calibrate listen: no pattern", "tone.wav: the recording holds no start pattern of a recording"
                + " sweep", d -> listen(d, write(d, "tone.wav", WavFixtures.sine16(48_000, 3, 440, 0.5)))));
        c.add(bad("calibrate listen: 8-bit recording", "u8.wav: a recording of 8-bit samples is too coarse for the"
                + " fit; record with 16 bits or more (or float)", d -> listen(d, write(d, "u8.wav",
                        WavFixtures.wav().layout(Layout.U8, 1, 48_000, new double[4800]).bytes()))));
        c.add(bad("calibrate listen: 4 kHz recording", "slow.wav: a recording at 4000 Hz is too slow for the fit;"
                + " record at 44.1 or 48 kHz (8 kHz at least)", d -> listen(d, write(d, "slow.wav",
                        WavFixtures.sine16(4000, 3, 440, 0.5)))));
        c.add(bad("calibrate listen: full-scale reading below code 0", "--full-scale-reading must be a reading of"
                + " the all-ones code, above code 0's 0V: -1V", d -> listen(d, write(d, "tone.wav",
                        WavFixtures.sine16(48_000, 3, 440, 0.5)), "--full-scale-reading", "-1V")));
        c.add(bad("calibrate listen: ladder described the other way round", "reversed.wav: the recording does not"
                + " follow the ladder: code 12 sits at 0.800 of the full swing, the model at 0.200 (parts of 1 %"
                + " keep it within 0.050); is it of another sweep", d -> reversed(d)));
        c.add(bad("calibrate listen: clipped, into a folder of an earlier fit", "clipped.wav: the recording clips",
                d -> {
                    Path out = Files.createDirectories(d.resolve("out"));
                    Files.writeString(out.resolve("bench.unit.toml"), "# an earlier profile, kept as it is\n");
                    return listen(d, recording(d, "clipped.wav", 1.3, 0.4, 0.3));
                }));
        c.add(bad("calibrate plan: meter counts not a count", "--meter-counts must be the meter's count, a whole"
                + " number such as 2000 (3½ digits) or 20000 (4½ digits): 3.5", d -> List.of("calibrate", "plan",
                        "--bits", "10", "--meter-counts", "3.5", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate plan: meter of 20 counts", "--meter-counts must be a meter's count, 200 .. 2000000"
                + " (2000 for a 3½-digit meter, 20000 for a 4½-digit one): 20", d -> List.of("calibrate", "plan",
                        "--bits", "10", "--meter-counts", "20", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate plan: a recording stepped by a button", "--recording needs the sweep's own timing;"
                + " leave --button out", d -> List.of("calibrate", "plan", "--bits", "6", "--recording", "--button",
                        "PB0", "--out", d.resolve("out").toString())));
        c.add(bad("calibrate fit: digits finer than --resolution", "readings.csv:3: the reading 0.313 V shows 1mV"
                + " digits, finer than --resolution 10mV; leave --resolution out to weight each reading by its own"
                + " digits, or correct it", d -> List.of("calibrate", "fit", write(d, "readings.csv",
                        "code,volts\n0,0.00\n1,0.313\n2,0.63\n3,0.94\n".getBytes(StandardCharsets.UTF_8)).toString(),
                        "--bits", "2", "--resolution", "10mV", "--out", d.resolve("out").toString())));
    }

    /** A recording of every code of the 4-bit ladder, held 40 ms, its full swing at {@code swing}. */
    private static Path recording(Path d, String name, double swing, double lead, double tail) {
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(SPEC.levels()), 0.040);
        return SyntheticRecording.wav(d.resolve(name), SyntheticRecording.record(sweep, SPEC.levels().levels(),
                SyntheticRecording.card(48_000, swing, 5.6e-5, lead, tail)), 48_000);
    }

    /**
     * A 4-bit weighted board of 80k (bit 0) .. 10k (bit 3) recorded, listened to with its resistors listed from
     * the top bit: the levels are far from that model's.
     */
    private static List<String> reversed(Path d) {
        LadderSpec built = LadderSpec.builder().topology(Topology.WEIGHTED).resistors(List.of(80e3, 40e3, 20e3,
                10e3)).tolerance(0.01).build();
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(built.levels()), 0.040);
        Path wav = SyntheticRecording.wav(d.resolve("reversed.wav"), SyntheticRecording.record(sweep,
                built.levels().levels(), SyntheticRecording.card(48_000, 0.5, 5.6e-5, 0.4, 0.3)), 48_000);
        return List.of("calibrate", "listen", wav.toString(), "--topology", "weighted", "--resistors",
                "10k,20k,40k,80k", "--tolerance", "1%", "--out", d.resolve("out").toString());
    }

    /** The file with only its first {@code samples} samples. */
    private static Path cut(Path wav, int samples) throws IOException {
        double[] y = org.rungtone.source.WavReader.read(wav).signal().samples();
        return SyntheticRecording.wav(wav, Arrays.copyOf(y, samples), 48_000);
    }

    private static Path write(Path d, String name, byte[] bytes) throws IOException {
        return Files.write(d.resolve(name), bytes);
    }

    /** The listen command line: the 4-bit ladder, then {@code more}, whose --bits wins. */
    private static List<String> listen(Path d, Path wav, String... more) {
        List<String> args = new ArrayList<>(List.of("calibrate", "listen", wav.toString()));
        args.addAll(List.of(LADDER));
        args.addAll(List.of(more));
        if (!args.contains("--bits")) {
            args.addAll(List.of("--bits", "4"));
        }
        args.addAll(List.of("--out", d.resolve("out").toString()));
        return args;
    }
}

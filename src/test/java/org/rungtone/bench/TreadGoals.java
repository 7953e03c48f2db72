package org.rungtone.bench;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.codec.TreadEncoder;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.Weighting;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.script.RungScript;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;

/**
 * The goals of the Tread store, measured ({@code ./bench tread}, never part of {@code mvn verify}):
 *
 * <ol>
 * <li>at equal A-weighted SNR (within 0.5 dB) a Tread store holds at least twice the seconds per byte of the
 * best plain or packed PCM setting, on the demo's sounds and on material of our own: a chord with
 * envelopes, a chime, a sweep and synthesized speech (espeak-ng, when installed);</li>
 * <li>encoding a 60 s sound at 16 kHz takes under 2 s.</li>
 * </ol>
 *
 * <p>Every sound is conditioned to 16 kHz (DC removed, peak at −1 dBFS). The PCM settings are N = 3 .. 10 bits
 * on the ideal ladder; each one's A-weighted SNR (AudioMetrics, IEC 61672-1 weighting) is a target level,
 * and its bytes are the packed ones (never more than unpacked). The Tread settings are tread2, tread3 and
 * tread4 to every ladder depth they decode to; a setting's bytes are its stream, the decoder's tables and one
 * reset point, as a player holds them. Neither side is dithered (dither only lowers a PCM setting's SNR). For
 * every target the cheapest Tread setting within 0.5 dB of it (or above) is compared with the PCM setting:
 * the ratio of their bytes is the ratio of their seconds per byte.
 */
public final class TreadGoals {
    private static final double RATE_HZ = 16_000;
    private static final double TOLERANCE_DB = 0.5;
    private static final int MIN_PCM_BITS = 3;
    private static final int MAX_PCM_BITS = 10;

    private TreadGoals() {
    }

    /**
     * Runs the goal check and prints the tables.
     *
     * @param args the repository folder (default the working folder)
     */
    public static void main(String[] args) throws IOException, InterruptedException {
        Path home = Path.of(args.length > 0 ? args[0] : ".");
        Map<String, Signal> sounds = new LinkedHashMap<>();
        sounds.put("demo: door chime (door-chime.wav)", condition(WavReader.read(home.resolve(
                "examples/greenhouse/door-chime.wav")).signal()));
        sounds.put("demo: frost alarm (frost-alarm.rung)", condition(RungScript.load(home.resolve(
                "examples/greenhouse/frost-alarm.rung")).render(RATE_HZ, 1)));
        sounds.put("chord with envelopes (synthesized)", condition(chord()));
        sounds.put("chime (synthesized)", condition(chime()));
        sounds.put("sweep 50 Hz .. 5 kHz (synthesized)", condition(sweep()));
        speech().ifPresentOrElse(s -> sounds.put("speech (espeak-ng)", condition(s)),
                () -> System.out.println("note: espeak-ng is not installed, so speech is skipped"
                        + " (apt-get install espeak-ng)"));
        List<String> summary = new ArrayList<>();
        for (Map.Entry<String, Signal> e : sounds.entrySet()) {
            summary.add(compare(e.getKey(), e.getValue()));
        }
        System.out.println("\nSummary (ratio of seconds per byte, Tread over the best PCM, at equal A-weighted SNR):");
        summary.forEach(System.out::println);
        encodeTime();
    }

    /** The table of one sound; returns its summary line. */
    private static String compare(String name, Signal s) {
        AudioMetrics metrics = AudioMetrics.of(s, RATE_HZ / 2);
        double[] pcmSnr = new double[MAX_PCM_BITS + 1];
        for (int n = MIN_PCM_BITS; n <= MAX_PCM_BITS; n++) {
            LevelTable t = LevelTable.ideal(n, 5);
            pcmSnr[n] = metrics.measure("pcm", new Quantizer(t, Dither.NONE, 1).apply(s).codes(), t).aWeightedSnrDb();
        }
        List<double[]> tread = new ArrayList<>();
        for (TreadFormat f : TreadFormat.values()) {
            for (int n = f.minLadderBits(); n <= TreadFormat.MAX_LADDER_BITS; n++) {
                LevelTable t = LevelTable.ideal(n, 5);
                TreadEncoder e = new TreadEncoder(f, new Quantizer(t, Dither.NONE, 1), Weighting.aWeighted(RATE_HZ,
                        RATE_HZ / 2));
                double snr = metrics.measure("tread", e.encode(s).quantized().codes(), t).aWeightedSnrDb();
                long bytes = f.streamBytes(s.length()) + f.playerTableBytes(n) + TreadFormat.resetBytes(n);
                tread.add(new double[] {f.codeBits(), n, snr, bytes});
            }
        }
        System.out.printf(Locale.ROOT, "%n%s: %.2f s, %d samples at 16 kHz%n", name, s.length() / RATE_HZ,
                s.length());
        System.out.printf(Locale.ROOT, "  %-9s %8s %12s   %-18s %8s %12s %7s%n", "PCM", "A-SNR dB", "bytes",
                "best Tread", "A-SNR dB", "bytes", "ratio");
        double worst = Double.POSITIVE_INFINITY;
        double best = 0;
        int met = 0;
        for (int n = MIN_PCM_BITS; n <= MAX_PCM_BITS; n++) {
            long pcmBytes = ((long) s.length() * n + 7) / 8;
            double target = pcmSnr[n];
            double[] pick = tread.stream().filter(r -> r[2] >= target - TOLERANCE_DB)
                    .min((a, b) -> Double.compare(a[3], b[3])).orElse(null);
            if (pick == null) {
                System.out.printf(Locale.ROOT, "  %2d-bit    %8.1f %,12d   %-18s%n", n, target, pcmBytes,
                        "none reaches it");
                worst = 0;
                continue;
            }
            double ratio = pcmBytes / pick[3];
            worst = Math.min(worst, ratio);
            best = Math.max(best, ratio);
            met += ratio >= 2 ? 1 : 0;
            System.out.printf(Locale.ROOT, "  %2d-bit    %8.1f %,12d   %-18s %8.1f %,12d %6.2fx%s%n", n, target,
                    pcmBytes, String.format(Locale.ROOT, "tread%d to %d bits", (int) pick[0], (int) pick[1]),
                    pick[2], (long) pick[3], ratio, ratio >= 2 ? "" : "  (under 2x)");
        }
        int levels = MAX_PCM_BITS - MIN_PCM_BITS + 1;
        return String.format(Locale.ROOT, "  %-40s 2x or more at %d of %d levels; ratios %.2fx .. %.2fx", name, met,
                levels, worst, best);
    }

    /** Median wall time of encoding the 60 s benchmark clip at 16 kHz, per format, after a warm-up. */
    private static void encodeTime() throws IOException {
        Path dir = Files.createTempDirectory("rungtone-tread");
        Path clip = dir.resolve("clip60.wav");
        ClipMaker.write(clip, 60);
        Signal s = new Conditioner(KaiserResampler.forBits(8)).apply(WavReader.read(clip).signal(),
                Conditioning.toRate(RATE_HZ)).signal();
        Files.delete(clip);
        Files.delete(dir);
        System.out.printf(Locale.ROOT, "%nEncoding the 60 s clip (%,d samples at 16 kHz) onto an 8-bit ladder,"
                + " median of 3 after a warm-up (goal: under 2 s); the encoder runs on one thread, so its CPU"
                + " time is what it costs on an idle core:%n", s.length());
        LevelTable t = LevelTable.ideal(8, 5);
        ThreadMXBean cpu = ManagementFactory.getThreadMXBean();
        for (TreadFormat f : TreadFormat.values()) {
            TreadEncoder e = new TreadEncoder(f, new Quantizer(t, Dither.TPDF, 1), Weighting.aWeighted(RATE_HZ,
                    RATE_HZ / 2));
            e.encode(s);
            double[] wall = new double[3];
            double[] busy = new double[3];
            for (int i = 0; i < wall.length; i++) {
                long start = System.nanoTime();
                long cpuStart = cpu.getCurrentThreadCpuTime();
                e.encode(s);
                busy[i] = (cpu.getCurrentThreadCpuTime() - cpuStart) / 1e9;
                wall[i] = (System.nanoTime() - start) / 1e9;
            }
            Arrays.sort(wall);
            Arrays.sort(busy);
            System.out.printf(Locale.ROOT, "  %s: %.2f s CPU, %.2f s wall (load average %.1f)%s%n", f.optionName(),
                    busy[1], wall[1], ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage(),
                    busy[1] < 2 ? "" : "  (over 2 s)");
        }
    }

    private static Signal condition(Signal s) {
        return new Conditioner(KaiserResampler.forBits(12)).apply(s, Conditioning.toRate(RATE_HZ)).signal();
    }

    /** C, E, G and C an octave up with their second harmonics, each note with its own attack and decay. */
    static Signal chord() {
        int n = (int) (RATE_HZ * 3);
        double[] x = new double[n];
        double[] f = {261.63, 329.63, 392.0, 523.25};
        for (int i = 0; i < n; i++) {
            double t = i / RATE_HZ;
            double sum = 0;
            for (int k = 0; k < f.length; k++) {
                double onset = 0.25 * k;
                double u = t - onset;
                double env = u < 0 ? 0 : u < 0.02 ? u / 0.02 : Math.exp(-(u - 0.02) * (1.0 + 0.4 * k));
                sum += env * (Math.sin(2 * Math.PI * f[k] * t) + 0.3 * Math.sin(4 * Math.PI * f[k] * t));
            }
            x[i] = sum;
        }
        return Signal.of(scale(x), RATE_HZ);
    }

    /** Inharmonic partials of a struck bar, the higher ones dying faster. */
    static Signal chime() {
        int n = (int) (RATE_HZ * 2.5);
        double[] x = new double[n];
        double[] f = {880, 2410, 4530, 6900};
        double[] a = {0.6, 0.25, 0.12, 0.05};
        double[] d = {2.0, 3.5, 6, 9};
        for (int i = 0; i < n; i++) {
            double t = i / RATE_HZ;
            double sum = 0;
            for (int k = 0; k < f.length; k++) {
                sum += a[k] * Math.exp(-d[k] * t) * Math.sin(2 * Math.PI * f[k] * t);
            }
            x[i] = sum * Math.min(1, t / 0.002);
        }
        return Signal.of(scale(x), RATE_HZ);
    }

    /** A logarithmic sweep from 50 Hz to 5 kHz in 3 s at constant level. */
    static Signal sweep() {
        int n = (int) (RATE_HZ * 3);
        double[] x = new double[n];
        double k = Math.log(5000 / 50.0);
        for (int i = 0; i < n; i++) {
            double t = i / RATE_HZ;
            x[i] = 0.7 * Math.sin(2 * Math.PI * 50 * 3 / k * (Math.exp(t * k / 3) - 1));
        }
        return Signal.of(x, RATE_HZ);
    }

    /** Speech made with espeak-ng, or empty when it is not installed. */
    static java.util.Optional<Signal> speech() throws IOException, InterruptedException {
        Path dir = Files.createTempDirectory("rungtone-speech");
        Path wav = dir.resolve("speech.wav");
        try {
            Process p = new ProcessBuilder("espeak-ng", "-w", wav.toString(), "The greenhouse door is open."
                    + " Frost warning: the temperature has fallen below two degrees. Please close the vents.")
                    .redirectErrorStream(true).start();
            p.getInputStream().readAllBytes();
            if (!p.waitFor(60, TimeUnit.SECONDS) || p.exitValue() != 0 || !Files.isRegularFile(wav)) {
                return java.util.Optional.empty();
            }
            return java.util.Optional.of(WavReader.read(wav).signal());
        } catch (IOException e) {
            return java.util.Optional.empty();
        } finally {
            Files.deleteIfExists(wav);
            Files.deleteIfExists(dir);
        }
    }

    private static double[] scale(double[] x) {
        double peak = 0;
        for (double v : x) {
            peak = Math.max(peak, Math.abs(v));
        }
        double g = 0.9 / peak;
        for (int i = 0; i < x.length; i++) {
            x[i] *= g;
        }
        return x;
    }
}

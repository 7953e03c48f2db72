package org.rungtone.project;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalLong;
import org.rungtone.analysis.LoopCrossfade;
import org.rungtone.analysis.LoopFinder;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.SoundClip;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.internal.Units;
import org.rungtone.internal.Warning;
import org.rungtone.quantize.Codes;
import org.rungtone.source.Signal;

/**
 * A loop found for the user ({@code loop = "auto"}): finds it in the conditioned sound ({@link LoopFinder}),
 * bakes its crossfades into the samples ({@link LoopCrossfade}) and, when the whole sound would not fit the
 * flash budget, keeps only its attack and one loop. Also lays out the preview, which plays the loop
 * {@link SeamlessLoop#PREVIEW_PASSES} times so that the seam can be heard.
 */
final class AutoLoop {
    /**
     * Flash the player's sound table grows by once a sound passes 65,535 samples (4 arrays of one 16-bit index
     * become 32-bit), counted in from the start so the shortened sound fits either way.
     */
    private static final long WIDE_INDEX_BYTES = 8;

    private AutoLoop() {
    }

    /**
     * The sound with its found loop.
     *
     * @param signal the conditioned sound with the crossfades baked in (shortened when {@code shortened} says so)
     * @param loop the loop, in samples of {@code signal}
     * @param shortened the warning that the sound was cut to its attack and one loop, when it was
     */
    record Placed(Signal signal, SeamlessLoop loop, Optional<Warning> shortened) {
    }

    /**
     * The found loop of a plan whose loop is {@code auto}, else empty.
     *
     * @throws SettingError about {@link Setting#LOOP} naming the source when the sound has no repeating section
     */
    static Optional<Placed> place(BuildPlan plan, Signal reference) {
        if (!plan.firmware().loop().map(LoopSpan::auto).orElse(false)) {
            return Optional.empty();
        }
        OptionalLong fits = fittingSamples(plan, reference.sampleRateHz());
        if (fits.isPresent() && fits.getAsLong() < reference.length()) {
            Optional<SeamlessLoop> within = LoopFinder.find(reference, (int) Math.max(0, fits.getAsLong()));
            if (within.isPresent()) {
                SeamlessLoop loop = within.get();
                Warning cut = new Warning(Warning.Kind.SOUND_SHORTENED, String.format(Locale.ROOT, "the sound was"
                        + " shortened to its attack and one loop (%s of %s) to fit the flash budget; what followed"
                        + " the loop is left out", Units.format(loop.end() / reference.sampleRateHz(), "s"),
                        Units.format(reference.durationSeconds(), "s")));
                return Optional.of(new Placed(LoopCrossfade.bake(reference, loop, loop.end()), loop,
                        Optional.of(cut)));
            }
        }
        SeamlessLoop loop = LoopFinder.find(reference).orElseThrow(() -> Setting.LOOP.problem(
                "%s: no repeating section found; give %s START:END", plan.source().file(), Setting.LOOP.ref()));
        return Optional.of(new Placed(LoopCrossfade.bake(reference, loop, reference.length()), loop,
                Optional.empty()));
    }

    /** The refusal of an automatic loop on a wavetable, which the dds engine repeats by itself. */
    static SettingError onWavetable(BuildPlan plan) {
        return Setting.LOOP.problem("%s: a wavetable is one cycle that the dds engine repeats by itself; %s auto"
                + " finds loops in sustained sounds: leave it out", plan.source().file(), Setting.LOOP.ref());
    }

    /**
     * The most samples the flash budget holds beside the player's own tables, or empty without a budget.
     * The player's tables are measured on a trial player of the same request holding a two-sample sound.
     */
    private static OptionalLong fittingSamples(BuildPlan plan, double rateHz) {
        OptionalLong budget = plan.firmware().flashBudgetBytes();
        if (budget.isEmpty()) {
            return OptionalLong.empty();
        }
        int bits = plan.bits();
        long room = budget.getAsLong();
        SampleStorage storage = SampleStorage.UNPACKED;
        if (plan.firmware().player().isPresent()) {
            FirmwareRequest request = plan.firmware().player().get();
            if (request.engine() != PlaybackEngine.LOOP && request.engine() != PlaybackEngine.CLIP) {
                return OptionalLong.empty(); // dds and sweep hold no clip to shorten
            }
            storage = request.storage();
            Codes two = Codes.of(bits, rateHz, new int[2]);
            FirmwareRequest trial = request.toBuilder().name(plan.symbol()).toolVersion("trial").flashBudgetBytes(0)
                    .sound(new SoundClip(plan.symbol(), two, 0, 2)).build();
            room -= FirmwareEmitter.render(trial).result().flashBytes() - storage.bytes(2, bits) + WIDE_INDEX_BYTES;
        }
        long n = Math.max(0, room) * 8 / bits;
        while (n > 0 && storage.bytes(n, bits) > room) {
            n--;
        }
        return OptionalLong.of(n);
    }

    /** The codes a preview plays: with a found loop, its passes ({@link #unrolled}); else the codes. */
    static Codes previewed(Codes codes, Optional<Placed> placed) {
        return placed.map(p -> unrolled(codes, p.loop(), SeamlessLoop.PREVIEW_PASSES)).orElse(codes);
    }

    /** The codes as a player plays them with the loop repeated {@code passes} times, then released. */
    static Codes unrolled(Codes codes, SeamlessLoop loop, int passes) {
        int[] c = codes.unsafeCodes();
        int length = loop.lengthSamples();
        int[] out = Arrays.copyOf(c, c.length + (passes - 1) * length);
        for (int p = 1; p < passes; p++) {
            System.arraycopy(c, loop.start(), out, loop.end() + (p - 1) * length, length);
        }
        System.arraycopy(c, loop.end(), out, loop.end() + (passes - 1) * length, c.length - loop.end());
        return Codes.of(codes.bits(), codes.sampleRateHz(), out);
    }
}

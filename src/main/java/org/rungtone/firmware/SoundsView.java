package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Template values of the clip and loop engines: the sounds and their places in the sample array.
 *
 * @param count how many sounds
 * @param list the sounds, in id order
 * @param starts each sound's first sample, as C initialisers ({@code 0u, 24u})
 * @param ends one past each sound's last sample
 * @param loopStarts each sound's loop start (loop engine)
 * @param loopEnds each sound's loop end, exclusive (loop engine)
 */
record SoundsView(int count, List<SoundView> list, String starts, String ends, String loopStarts,
        String loopEnds) {
    /**
     * One sound.
     *
     * @param soundMacro the sound's name for its id macro, upper case
     * @param id the sound's id
     * @param lengthText its length in samples, with thousands separators
     * @param durationMs its duration in milliseconds, one decimal
     * @param loopStart its loop start, in samples from its start
     * @param loopEnd its loop end, exclusive
     */
    record SoundView(String soundMacro, int id, String lengthText, String durationMs, int loopStart, int loopEnd) {
    }

    /** The values of the plan's sounds. */
    static SoundsView of(EmitPlan p) {
        List<SoundView> list = new ArrayList<>();
        StringBuilder starts = new StringBuilder();
        StringBuilder ends = new StringBuilder();
        StringBuilder loopStarts = new StringBuilder();
        StringBuilder loopEnds = new StringBuilder();
        for (int i = 0; i < p.sounds.size(); i++) {
            SoundClip s = p.sounds.get(i);
            list.add(new SoundView(CNames.macro(p.soundSymbols.get(i)), i, Fmt.bytes(s.codes().length()),
                    String.format(Locale.ROOT, "%.1f", 1000.0 * s.codes().length() / s.codes().sampleRateHz()),
                    s.loopStart(), s.loopEnd()));
            String sep = i == 0 ? "" : ", ";
            long at = p.soundStarts[i];
            starts.append(sep).append(at).append('u');
            ends.append(sep).append(at + s.codes().length()).append('u');
            loopStarts.append(sep).append(at + s.loopStart()).append('u');
            loopEnds.append(sep).append(at + s.loopEnd()).append('u');
        }
        return new SoundsView(list.size(), List.copyOf(list), starts.toString(), ends.toString(),
                loopStarts.toString(), loopEnds.toString());
    }
}

package org.rungtone.script.ast;

import java.util.Collection;
import org.rungtone.internal.EditDistance;

/**
 * Picks the known name nearest to a misspelt one, by optimal-string-alignment edit distance (Levenshtein
 * distance plus swaps of neighbouring letters; F. J. Damerau, "A technique for computer detection and
 * correction of spelling errors", Comm. ACM 7(3), 1964).
 */
public final class Suggestions {
    private Suggestions() {
    }

    /**
     * The candidate nearest to {@code word}, or null when none is close: one edit for words of up to three
     * letters, two for longer ones. Ties go to the candidate listed first.
     */
    public static String nearest(String word, Collection<String> candidates) {
        String best = null;
        int bestDistance = Integer.MAX_VALUE;
        int limit = word.length() <= 1 ? 0 : word.length() <= 3 ? 1 : 2;
        for (String c : candidates) {
            int d = EditDistance.of(word, c);
            if (d <= limit && d < bestDistance) {
                best = c;
                bestDistance = d;
            }
        }
        return best;
    }

    /** Like {@link #nearest}, but a unit that differs only in letter case always matches. */
    static String nearestUnit(String word, Collection<String> units) {
        for (String u : units) {
            if (u.equalsIgnoreCase(word)) {
                return u;
            }
        }
        return word.length() < 2 ? null : nearest(word, units);
    }
}

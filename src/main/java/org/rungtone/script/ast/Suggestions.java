package org.rungtone.script.ast;

import java.util.Collection;

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
            int d = distance(word, c);
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

    /** Optimal-string-alignment distance between {@code a} and {@code b}. */
    public static int distance(String a, String b) {
        int[][] d = new int[a.length() + 1][b.length() + 1];
        for (int i = 0; i <= a.length(); i++) {
            d[i][0] = i;
        }
        for (int j = 0; j <= b.length(); j++) {
            d[0][j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            for (int j = 1; j <= b.length(); j++) {
                int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
                int v = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    v = Math.min(v, d[i - 2][j - 2] + 1);
                }
                d[i][j] = v;
            }
        }
        return d[a.length()][b.length()];
    }
}

package org.rungtone.internal;

/**
 * The optimal-string-alignment distance (Levenshtein's insertions, deletions and substitutions, plus the
 * transposition of two neighbouring letters; F. J. Damerau, CACM 7(3), 1964): how far a mistyped word is from a
 * known one, for "did you mean" hints on options, script names and project keys.
 */
public final class EditDistance {
    private EditDistance() {
    }

    /** The number of single-letter edits (or swaps of neighbours) that turn {@code a} into {@code b}. */
    public static int of(String a, String b) {
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

package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.EditDistance;

/**
 * The known words nearest a mistyped one: by edit distance (a letter inserted, left out, changed, or two
 * neighbours swapped: the optimal string alignment distance), else the one word the typed text begins.
 * Leading dashes and case are ignored, so {@code --Bitz} is one edit from {@code --bits}.
 */
final class Spelling {
    private Spelling() {
    }

    /**
     * The known words closest to {@code typed}, in their given order, at most a couple of edits away (one for
     * words of four letters or fewer, none for a single letter); empty when none is close.
     */
    static List<String> nearest(String typed, Collection<String> known) {
        String t = bare(typed);
        // one edit in a short word, two in a longer one, and never a word with no letter right
        int limit = Math.min(t.length() <= 4 ? 1 : 2, t.length() - 1);
        int best = limit + 1;
        List<String> found = new ArrayList<>();
        for (String word : known) {
            int d = EditDistance.of(t, bare(word));
            if (d < best) {
                best = d;
                found.clear();
            }
            if (d == best && d <= limit) {
                found.add(word);
            }
        }
        if (found.isEmpty() && t.length() >= 3) {
            for (String word : known) {
                if (bare(word).startsWith(t)) {
                    found.add(word);
                }
            }
            return found.size() == 1 ? found : List.of();
        }
        return found;
    }

    private static String bare(String word) {
        int start = 0;
        while (start < word.length() && word.charAt(start) == '-') {
            start++;
        }
        return word.substring(start).toLowerCase(Locale.ROOT);
    }
}

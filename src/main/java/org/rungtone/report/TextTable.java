package org.rungtone.report;

import java.util.ArrayList;
import java.util.List;

/**
 * Aligned plain-text tables for reports: a header row, a rule, then rows. Columns whose cells all look
 * numeric are right-aligned, others left-aligned. Output uses {@code \n} and no trailing spaces.
 */
public final class TextTable {
    private final List<String> header;
    private final List<List<String>> rows = new ArrayList<>();

    /** A table with these column titles. */
    public TextTable(String... header) {
        this.header = List.of(header);
    }

    /** Adds a row; missing cells print empty. */
    public TextTable row(Object... cells) {
        List<String> r = new ArrayList<>();
        for (Object c : cells) {
            r.add(String.valueOf(c));
        }
        rows.add(r);
        return this;
    }

    /** Number of data rows. */
    public int size() {
        return rows.size();
    }

    /** Renders the table, each line prefixed by {@code indent}. */
    public String render(String indent) {
        int cols = header.size();
        int[] width = new int[cols];
        boolean[] numeric = new boolean[cols];
        for (int c = 0; c < cols; c++) {
            width[c] = header.get(c).length();
            numeric[c] = true;
        }
        for (List<String> r : rows) {
            for (int c = 0; c < cols && c < r.size(); c++) {
                width[c] = Math.max(width[c], r.get(c).length());
                if (!r.get(c).isEmpty() && !r.get(c).matches("[-+]?[0-9.,]+.*")) {
                    numeric[c] = false;
                }
            }
        }
        StringBuilder b = new StringBuilder();
        line(b, indent, header, width, numeric);
        StringBuilder rule = new StringBuilder();
        for (int c = 0; c < cols; c++) {
            if (c > 0) {
                rule.append("  ");
            }
            rule.append("-".repeat(width[c]));
        }
        b.append(indent).append(rule).append('\n');
        for (List<String> r : rows) {
            line(b, indent, r, width, numeric);
        }
        return b.toString();
    }

    private static void line(StringBuilder b, String indent, List<String> cells, int[] width, boolean[] right) {
        StringBuilder l = new StringBuilder(indent);
        for (int c = 0; c < width.length; c++) {
            String s = c < cells.size() ? cells.get(c) : "";
            if (c > 0) {
                l.append("  ");
            }
            String pad = " ".repeat(Math.max(0, width[c] - s.length()));
            l.append(right[c] ? pad + s : s + pad);
        }
        int end = l.length();
        while (end > 0 && l.charAt(end - 1) == ' ') {
            end--;
        }
        b.append(l, 0, end).append('\n');
    }
}

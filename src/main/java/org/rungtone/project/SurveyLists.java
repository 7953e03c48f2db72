package org.rungtone.project;

import java.util.ArrayList;
import java.util.List;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;

/**
 * The survey's lists of bit depths and rates: read as written (malformed text is refused as such), then
 * checked against the survey's rules (a value out of range or repeated is bad input naming its setting).
 */
public final class SurveyLists {
    private SurveyLists() {
    }

    /** A list of bit depths: ranges {@code a..b} and single depths, as written. */
    public record BitList(String text, List<Range> ranges) {
        /** Copies the ranges. */
        public BitList {
            ranges = List.copyOf(ranges);
        }

        /** The record's usual text, written out (see {@link RateList#toString}). */
        @Override
        public String toString() {
            return "BitList[text=" + text + ", ranges=" + ranges + "]";
        }

        /**
         * The depths in order.
         *
         * @throws org.rungtone.internal.SettingError when a depth is outside 1..16 or repeats
         */
        public List<Integer> expand() {
            List<Integer> out = new ArrayList<>();
            for (Range r : ranges) {
                for (int end : new int[] {r.first(), r.last()}) {
                    Setting.SURVEY_BITS.check(end >= 1 && end <= 16, "%s: bit depth must be 1..16: %d", text, end);
                }
                for (int b = r.first(); b <= r.last(); b++) {
                    Setting.SURVEY_BITS.check(!out.contains(b), "%s: %d appears twice; give each depth once", text,
                            b);
                    out.add(b);
                }
            }
            return out;
        }

        /** Depths {@code first} to {@code last}, both included; a single depth is a range of one. */
        public record Range(int first, int last) {
            /** The record's usual text, written out (see {@link RateList#toString}). */
            @Override
            public String toString() {
                return "Range[first=" + first + ", last=" + last + "]";
            }
        }

        /**
         * Reads "1..12", "4,6,8", "2..4,8".
         *
         * @throws IllegalArgumentException for malformed text, with the message to show
         */
        public static BitList parse(String value) {
            List<Range> ranges = new ArrayList<>();
            for (String item : value.split(",", -1)) {
                String[] ends = item.trim().split("\\.\\.", -1);
                if (ends.length > 2) {
                    throw new IllegalArgumentException("'" + item + "' is not a bit depth or a range like 4..10");
                }
                int from = depth(ends[0], item);
                int to = ends.length == 2 ? depth(ends[1], item) : from;
                if (to < from) {
                    throw new IllegalArgumentException("the range '" + item + "' runs backwards; write "
                            + to + ".." + from);
                }
                ranges.add(new Range(from, to));
            }
            return new BitList(value, ranges);
        }

        private static int depth(String text, String item) {
            try {
                return Integer.parseInt(text.trim());
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("'" + item + "' is not a bit depth or a range like 4..10"
                        + " (e.g. 1..12 or 4,6,8)");
            }
        }
    }

    /** A list of sample rates in hertz, as written. */
    public record RateList(String text, List<Double> ratesHz) {
        /** Copies the rates. */
        public RateList {
            ratesHz = List.copyOf(ratesHz);
        }

        /**
         * The record's usual text, written out: the generated method builds its method handles on first use,
         * which costs a start-up tens of milliseconds, and the command line turns every option value into text.
         */
        @Override
        public String toString() {
            return "RateList[text=" + text + ", ratesHz=" + ratesHz + "]";
        }

        /**
         * The rates, checked.
         *
         * @throws org.rungtone.internal.SettingError when a rate is outside 1 Hz..384 kHz or repeats
         */
        public List<Double> checked() {
            List<Double> out = new ArrayList<>();
            for (double r : ratesHz) {
                Setting.SURVEY_RATES.check(r >= 1 && r <= 384_000, "%s: a sample rate must be 1 Hz..384 kHz: %s",
                        text, Units.format(r, "Hz"));
                Setting.SURVEY_RATES.check(!out.contains(r), "%s: %s appears twice; give each rate once", text,
                        Units.format(r, "Hz"));
                out.add(r);
            }
            return out;
        }

        /**
         * Reads "8k,11.025k,16kHz".
         *
         * @throws IllegalArgumentException for malformed text, with the message to show
         */
        public static RateList parse(String value) {
            List<Double> rates = new ArrayList<>();
            for (String item : value.split(",", -1)) {
                try {
                    rates.add(Units.parse(item, "Hz"));
                } catch (org.rungtone.internal.InputError e) {
                    throw new IllegalArgumentException(e.getMessage(), e);
                }
            }
            return new RateList(value, rates);
        }
    }
}

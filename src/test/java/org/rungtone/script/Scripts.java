package org.rungtone.script;

/** Small helpers for script tests: wrap an expression in a clip and render it. */
final class Scripts {
    private Scripts() {
    }

    /** Renders {@code out EXPR} as a clip of {@code seconds} at {@code rateHz}, seed 1. */
    static double[] clip(String expr, double seconds, double rateHz) {
        return clip("", expr, seconds, rateHz, 1);
    }

    /** Renders a clip with the given {@code let} lines and output expression. */
    static double[] clip(String lets, String expr, double seconds, double rateHz, long seed) {
        String source = "duration " + seconds + "s\n" + lets + "\nout " + expr + "\n";
        return RungScript.parse(source, "test.rung").render(rateHz, seed).samples();
    }

    /** The s-expression of {@code out EXPR} inside a one-second clip. */
    static String out(String expr) {
        String all = RungScript.parse("duration 1s\nout " + expr, "test.rung").toSExpression();
        String prefix = "(script (duration 1) (out ";
        return all.substring(prefix.length(), all.length() - 2);
    }
}

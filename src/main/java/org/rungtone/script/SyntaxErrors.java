package org.rungtone.script;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.rungtone.script.ast.Literals;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.parser.ParseException;
import org.rungtone.script.parser.RungParserConstants;
import org.rungtone.script.parser.Token;

/**
 * Turns the generated parser's {@link ParseException} into one readable line: what was found, what could
 * have come there (grouped: "an expression", "an operator", "a statement"), and a hint for common slips.
 */
final class SyntaxErrors implements RungParserConstants {
    private SyntaxErrors() {
    }

    static ScriptError of(ParseException e, SourceText source) {
        Token bad = e.currentToken.next;
        Set<Integer> expected = new TreeSet<>();
        if (e.expectedTokenSequences != null) {
            for (int[] sequence : e.expectedTokenSequences) {
                if (sequence.length > 0) {
                    expected.add(sequence[0]);
                }
            }
        }
        Pos pos = bad.kind == EOF ? SourceText.after(e.currentToken) : new Pos(bad.beginLine, bad.beginColumn);
        if (bad.kind == EOF && e.currentToken.kind == EOF) {
            pos = new Pos(1, 1);
        }
        return source.error(pos, "unexpected " + found(bad) + "; " + advice(e.currentToken, bad, expected));
    }

    private static String advice(Token previous, Token bad, Set<Integer> expected) {
        boolean expression = expected.contains(NUMBER);
        boolean operator = expected.contains(STAR);
        boolean statement = expected.contains(LET);
        if (bad.kind == NAME && bad.next != null && bad.next.kind == ASSIGN && statement) {
            return "did you mean 'let " + bad.image + " = ...'?";
        }
        if (bad.kind == IF && expression) {
            return "a conditional inside a larger expression needs parentheses: (if ... then ... else ...)";
        }
        if (bad.kind == DB_NUMBER && operator && (bad.image.startsWith("-") || bad.image.startsWith("+"))) {
            char sign = bad.image.charAt(0);
            String verb = sign == '-' ? "subtract" : "add";
            return "expected an operator (write '" + sign + " " + bad.image.substring(1) + "' to " + verb
                    + " it, or '* " + bad.image + "' to apply it as a gain)";
        }
        if (bad.kind == NAME && previous.kind == NUMBER && operator
                && (Literals.units().contains(bad.image) || bad.image.equals("dB"))) {
            return "did you mean '" + previous.image + bad.image + "' (no space before the unit)?";
        }
        List<String> parts = new ArrayList<>();
        if (expression) {
            parts.add("an expression");
        }
        if (operator) {
            parts.add("an operator");
        }
        int[] singles = {RPAREN, COMMA, ASSIGN, THEN, ELSE};
        for (int kind : singles) {
            if (expected.contains(kind)) {
                parts.add("'" + tokenImage[kind].replace("\"", "") + "'");
            }
        }
        if (!expression && expected.contains(NAME)) {
            parts.add("a name");
        }
        if (statement) {
            parts.add("a statement (let, out, duration, wavetable or rate)");
        } else if (expected.contains(EOF)) {
            parts.add("the end of the file");
        }
        return "expected " + join(parts);
    }

    private static String join(List<String> parts) {
        if (parts.isEmpty()) {
            return "something else here";
        }
        if (parts.size() == 1) {
            return parts.get(0);
        }
        return String.join(", ", parts.subList(0, parts.size() - 1)) + " or " + parts.get(parts.size() - 1);
    }

    private static String found(Token t) {
        switch (t.kind) {
            case EOF:
                return "end of file";
            case NUMBER:
                return "number '" + t.image + "'";
            case DB_NUMBER:
                return "gain '" + t.image + "'";
            case NOTE:
                return "note '" + t.image + "'";
            case NAME:
                return "name '" + t.image + "'";
            case ILLEGAL:
                return "character '" + t.image + "'";
            default:
                return "'" + t.image + "'";
        }
    }
}

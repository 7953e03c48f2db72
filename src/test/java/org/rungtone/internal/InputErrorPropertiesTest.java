package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;
import org.rungtone.script.ScriptError;

/**
 * An input error's message is one line whatever user text it quotes, because the command line prints it as
 * exactly one line after {@code rungtone: error: }.
 */
class InputErrorPropertiesTest {
    @Property(tries = 500)
    void messagesStayOnOneLine(@ForAll String quoted) {
        String m = new InputError("board.toml:3: name: '" + quoted + "' is not usable").getMessage();
        assertEquals(1, m.lines().count(), m);
        assertTrue(m.chars().noneMatch(c -> c < 0x20 || c == 0x7F || c == 0x85 || c == 0x2028 || c == 0x2029), m);
        String s = new ScriptError("a.rung", 1, 1, "unknown name '" + quoted + "'", quoted).getMessage();
        assertEquals(1, s.lines().count(), s);
    }

    @Property(tries = 200)
    void printableTextIsKeptAsWritten(@ForAll("printable") String quoted) {
        assertEquals("x: " + quoted, new InputError("x: " + quoted).getMessage());
    }

    @Provide
    Arbitrary<String> printable() {
        return Arbitraries.strings().withCharRange(' ', '~').withCharRange('\u00a0', '\u024f');
    }

    @Test
    void controlCharactersBecomeEscapes() {
        assertEquals("name 'a\\rb\\nc\\td\\u001Be'", new InputError("name 'a\rb\nc\td\u001be'").getMessage());
    }
}

package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;

class CNamesTest {
    @Test
    void sanitizesNames() {
        assertEquals("door_chime", CNames.symbol("Door Chime!"));
        assertEquals("snd_2nd_bell", CNames.symbol("2nd-bell"));
        assertEquals("a_b", CNames.symbol("  a...b__ "));
        assertEquals("DOOR_CHIME", CNames.macro("door_chime"));
    }

    @Test
    void rejectsNamesThatCannotBecomeIdentifiers() {
        assertEquals("sound.name '!!!' has no letters or digits to make a C symbol from; use e.g. sound.name"
                + " door_chime",
                assertThrows(InputError.class, () -> CNames.symbol("!!!")).getMessage());
        assertEquals("sound.name 'int' would make the C keyword 'int'; choose another name, e.g. int_sound",
                assertThrows(InputError.class, () -> CNames.symbol("int")).getMessage());
    }

    @Test
    void saysWhatANameBecameAndWhy() {
        assertTrue(CNames.rewritten("door_chime").isEmpty(), "a name that is its symbol needs no note");
        assertTrue(CNames.rewritten("Door-Chime.v2").isEmpty(), "case and separators need no note");
        assertEquals("the name '9x' became the C symbol prefix 'snd_9x': a C identifier cannot start with a digit,"
                + " so 'snd_' goes first; to choose it yourself, give a name that already is one",
                CNames.rewritten("9x").orElseThrow());
        assertEquals("the name 'Glöckchen' became the C symbol prefix 'gl_ckchen': symbols are lower case; anything"
                + " but ASCII letters and digits becomes one '_' (none at either end); to choose it yourself, give a"
                + " name that already is one", CNames.rewritten("Glöckchen").orElseThrow());
        assertTrue(CNames.rewritten("../x").orElseThrow().startsWith("the name '../x' became the C symbol prefix"
                + " 'x': anything but"));
    }
}

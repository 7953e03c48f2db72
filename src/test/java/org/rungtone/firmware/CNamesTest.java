package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

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
}

package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class WarningTest {
    @Test
    void isKnownByItsKindNotItsText() {
        Warning w = new Warning(Warning.Kind.NOT_MONOTONIC, "pin current looks fine");
        assertTrue(w.is(Warning.Kind.NOT_MONOTONIC));
        assertFalse(w.is(Warning.Kind.PIN_CURRENT));
        assertEquals(Warning.Kind.OTHER, Warning.other("not monotonic").kind());
    }

    @Test
    void textsKeepTheOrder() {
        assertEquals(List.of("b", "a"), Warning.texts(List.of(Warning.other("b"),
                new Warning(Warning.Kind.PIN_CURRENT, "a"))));
    }

    @Test
    void needsKindAndText() {
        assertThrows(NullPointerException.class, () -> new Warning(null, "x"));
        assertThrows(NullPointerException.class, () -> new Warning(Warning.Kind.OTHER, null));
    }
}

package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;

class SettingErrorTest {
    @Test
    void messageNamesSettingsByTheirKeys() {
        SettingError e = Setting.RATE.error("is too fast; raise %s", Setting.CPU_CLOCK.ref());
        assertEquals("quantize.rate is too fast; raise target.cpu_clock", e.getMessage());
        assertEquals(Setting.RATE, e.setting());
    }

    @Test
    void rendersEveryPlaceHolderWithTheNamesItIsGiven() {
        SettingError e = Setting.RATE.error("is too fast; raise %s", Setting.CPU_CLOCK.ref());
        assertEquals("-rate is too fast; raise -clock",
                e.render(s -> s == Setting.RATE ? "-rate" : "-clock"));
    }

    @Test
    void detailDropsOnlyTheLeadingName() {
        SettingError e = Setting.LOOP.error("'%s' needs 0 <= START < END; see %s", "5:1", Setting.LOOP.ref());
        assertEquals("'5:1' needs 0 <= START < END; see sound.loop", e.detail(Setting::key));
        SettingError free = Setting.GAIN.problem("give either %s or %s", Setting.GAIN.ref(),
                Setting.NORMALIZE.ref());
        assertEquals("give either sound.gain or sound.normalize", free.detail(Setting::key));
    }

    @Test
    void controlCharactersInTheUsersTextStayOnOneLine() {
        SettingError e = Setting.PINS.error("'%s' is not a pin", "PB0\nPB1");
        assertEquals("target.pins 'PB0\\nPB1' is not a pin", e.getMessage());
        assertEquals("--pins 'PB0\\nPB1' is not a pin", e.render(s -> "--pins"));
    }

    @Test
    void braceTextThatIsNoSettingIsLeftAlone() {
        SettingError e = Setting.OUT.problem("%s: no folder {a.b} here", "x{y}");
        assertEquals("x{y}: no folder {a.b} here", e.render(Setting::key));
    }

    @Test
    void aBraceInTheUsersTextIsNeverReadAsASetting() {
        SettingError e = Setting.PINS.error("'%s' is not a pin; see %s", "{quantize.rate}x", Setting.RATE.ref());
        assertEquals("--pins '{quantize.rate}x' is not a pin; see --rate",
                e.render(s -> s == Setting.PINS ? "--pins" : "--rate"));
    }

    @Test
    void checkThrowsOnlyWhenTheConditionFails() {
        Setting.BITS.check(true, "must be 1..16: %d", 4);
        SettingError e = assertThrows(SettingError.class, () -> Setting.BITS.check(false, "must be 1..16: %d", 0));
        assertEquals("quantize.bits must be 1..16: 0", e.getMessage());
    }

    @Test
    void keysAreUniqueAndSectioned() {
        Set<String> keys = new HashSet<>();
        for (Setting s : Setting.values()) {
            assertEquals(true, keys.add(s.key()), s.key());
            assertEquals(true, s.key().matches("[a-z]+\\.[a-z_]+"), s.key());
            assertEquals(s, Setting.ofKey(s.key()).orElseThrow());
        }
    }
}

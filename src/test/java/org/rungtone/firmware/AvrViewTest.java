package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class AvrViewTest {
    @Test
    void avrClockSelectBitsFollowTheDatasheetTables() {
        // ATmega328P datasheet, "Clock Select Bit Description" (from memory): timers 0 and 1 use
        // CSn2:0 = 1..5 for prescalers 1, 8, 64, 256, 1024; timer 2 uses 1..7 for 1, 8, 32, 64, 128, 256, 1024.
        assertEquals("_BV(CS10)", AvrView.clockSelect(TimerKind.AVR_TIMER1, 1));
        assertEquals("(_BV(CS11) | _BV(CS10))", AvrView.clockSelect(TimerKind.AVR_TIMER1, 64));
        assertEquals("(_BV(CS02) | _BV(CS00))", AvrView.clockSelect(TimerKind.AVR_TIMER0, 1024));
        assertEquals("_BV(CS02)", AvrView.clockSelect(TimerKind.AVR_TIMER0, 256));
        assertEquals("(_BV(CS21) | _BV(CS20))", AvrView.clockSelect(TimerKind.AVR_TIMER2, 32));
        assertEquals("(_BV(CS22) | _BV(CS21) | _BV(CS20))", AvrView.clockSelect(TimerKind.AVR_TIMER2, 1024));
    }
}

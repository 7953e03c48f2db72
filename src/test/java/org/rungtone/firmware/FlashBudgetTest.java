package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;

class FlashBudgetTest {
    @Test
    void passesWithinBudget() {
        FlashBudget.check(10000, 10000, List.of());
    }

    @Test
    void namesTheOverrunAndTheFirstCandidateThatFits() {
        List<FlashBudget.Candidate> c = List.of(new FlashBudget.Candidate("8-bit packed at 11.025 kHz", 11000),
                new FlashBudget.Candidate("6-bit packed at 8 kHz", 7812));
        assertEquals("the samples need 12,345 bytes, 2,345 bytes over the 10,000-byte flash budget"
                + " (target.flash_budget); 6-bit packed at 8 kHz would fit (7,812 bytes)",
                assertThrows(InputError.class,
                        () -> FlashBudget.check(12345, 10000, c)).getMessage());
    }

    @Test
    void proposesTheLargestSettingThatFits() {
        // 2 s of 8-bit sound at 16 kHz: 32,000 bytes unpacked. Packed at 16 kHz: 7 bits 28,000, 6 bits
        // 24,000, 5 bits 20,000; at 11.025 kHz (22,050 samples): 8 bits 22,050, 7 bits 19,294 ...
        // With a 21,000-byte budget the largest that fits is 5-bit packed at 16 kHz (20,000 bytes).
        List<FlashBudget.Candidate> c = FlashBudget.alternatives(32000, 16000, 8, SampleStorage.UNPACKED, 0);
        assertEquals("the samples need 32,000 bytes, 11,000 bytes over the 21,000-byte flash budget"
                + " (target.flash_budget); 5-bit packed at 16 kHz would fit (20,000 bytes)",
                assertThrows(InputError.class,
                        () -> FlashBudget.check(32000, 21000, c)).getMessage());
    }

    @Test
    void proposesSmallerTreadStoresForATreadStore() {
        // 2 s at 16 kHz as tread4: 16,000 bytes of stream. tread3 at 16 kHz takes 12,000, tread2 8,000; tread4
        // at 11.025 kHz (22,050 samples) 11,025: with a 12,500-byte budget the largest that fits is tread3
        // at 16 kHz (plus the 300 bytes of tables that do not depend on the setting)
        List<FlashBudget.Candidate> c = FlashBudget.alternatives(32000, 16000, 8, SampleStorage.TREAD4, 300);
        assertEquals("the samples need 16,300 bytes, 3,800 bytes over the 12,500-byte flash budget"
                + " (target.flash_budget); tread3 at 16 kHz would fit (12,300 bytes)",
                assertThrows(InputError.class, () -> FlashBudget.check(16300, 12500, c)).getMessage());
    }

    @Test
    void saysSoWhenNothingFits() {
        List<FlashBudget.Candidate> c = FlashBudget.alternatives(800000, 8000, 8, SampleStorage.PACKED, 0);
        assertEquals("the samples need 800,000 bytes, 799,900 bytes over the 100-byte flash budget"
                + " (target.flash_budget); no smaller bit depth or rate fits either: shorten the"
                + " sound or raise the budget", assertThrows(
                        InputError.class, () -> FlashBudget.check(800000, 100, c)).getMessage());
    }
}

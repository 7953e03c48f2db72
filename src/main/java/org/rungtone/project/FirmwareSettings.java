package org.rungtone.project;

import java.util.Optional;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.internal.Setting;

/**
 * What is emitted around one sound's samples.
 *
 * @param player the player to emit (everything but the sounds), or empty for the sample array alone
 * @param loop loop points of a looped sound
 * @param flashBudgetBytes the most flash the samples may take, 0 for no limit
 * @param flashQualifier attribute that keeps a bare sample array in flash
 */
public record FirmwareSettings(Optional<FirmwareRequest> player, Optional<LoopSpan> loop, long flashBudgetBytes,
        String flashQualifier) {
    /** Validates the budget. */
    public FirmwareSettings {
        Setting.FLASH_BUDGET.check(flashBudgetBytes >= 0, "must be positive: %d", flashBudgetBytes);
    }
}

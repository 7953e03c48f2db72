package org.rungtone.firmware;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

/**
 * What {@link FirmwareEmitter#emit} wrote and found.
 *
 * @param files the files written: header, player source, data source
 * @param report one line per topic (target, engine, tick rate and timer, pins, strategy, port update and
 *     glitch, storage, flash, sounds, DDS, sweep), also the parameters in every file's header comment
 * @param flashBytes bytes of the emitted tables (samples, sound table, pin tables, sweep codes), without code
 * @param timer the solved timer, when the target programs one (or a hint for generic when a timer is named)
 * @param pinStrategy the strategy used for the pins
 * @param warnings problems that do not stop the build
 * @param tickCost the measured worst-case cost of one tick and the glitch window, where the family has figures
 * @param facts the report's facts as values, for machine-readable reports
 */
public record EmitResult(List<Path> files, List<String> report, long flashBytes, Optional<TimerSetting> timer,
        PinStrategy pinStrategy, List<String> warnings, Optional<TickCost> tickCost, FirmwareFacts facts) {
    /** Copies the lists. */
    public EmitResult {
        files = List.copyOf(files);
        report = List.copyOf(report);
        warnings = List.copyOf(warnings);
    }
}

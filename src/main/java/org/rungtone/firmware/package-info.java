/**
 * C99 output for the microcontroller: pin maps ({@link org.rungtone.firmware.PinMap}) with shift, table or
 * scatter code, packed or unpacked sample storage, timer solving, the DDS reference model, the clip, loop,
 * DDS and sweep players, and their rendering from the top-level {@code templates/} folder for the generic,
 * avr and cortexm families, whose templates see typed view records (one per part of the player, the family's
 * registers in a view of their own); {@link org.rungtone.firmware.FirmwareEmitter} is the entry point and
 * checks a whole {@link org.rungtone.firmware.FirmwareRequest} before it writes anything.
 */
package org.rungtone.firmware;

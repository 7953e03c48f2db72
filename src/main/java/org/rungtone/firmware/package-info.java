/**
 * C99 output for the microcontroller: the emit model, C identifier rules, sample storage, pin maps, timer
 * settings and template rendering from the top-level {@code templates/} folder.
 */
package org.rungtone.firmware;

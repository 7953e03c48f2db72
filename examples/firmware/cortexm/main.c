/*
 * main.c: plays a Rungtone sound on a Cortex-M (STM32F4-class GPIO and SysTick), part of Rungtone's firmware
 * examples.
 *
 * Licence of this file: MIT. Permission is hereby granted, free of charge, to any person obtaining a copy
 * of this file, to deal in it without restriction, including without limitation the rights to use, copy,
 * modify, merge, publish, distribute, sublicense, and/or sell copies, in source or binary form (for example
 * inside closed firmware). THE FILE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND.
 *
 * Build the C files first (cortexm family, pins PB0-PB7, 16 MHz, name "chime"; see README.md), then build with
 * CMake. chime_init() enables the GPIO clock, makes PB0-PB7 push-pull outputs parked at mid-scale and starts
 * SysTick, whose handler writes one code per tick through BSRR; the main loop sleeps between ticks and plays
 * the sound again and again.
 */
#include "chime.h"

int main(void)
{
    chime_init();
    for (;;) {
        chime_play(CHIME_SOUND_CHIME);
        while (!chime_is_done()) {
            __asm__ volatile("wfi");   /* sleep until the next interrupt */
        }
    }
}

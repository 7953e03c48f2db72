/*
 * main.c: plays a Rungtone sound on an ATmega328P at 16 MHz, part of Rungtone's firmware examples.
 *
 * Licence of this file: MIT. Permission is hereby granted, free of charge, to any person obtaining a copy
 * of this file, to deal in it without restriction, including without limitation the rights to use, copy,
 * modify, merge, publish, distribute, sublicense, and/or sell copies, in source or binary form (for example
 * inside closed firmware). THE FILE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND.
 *
 * Build the C files first (avr family, pins PD2-PD7, 16 MHz, name "chime"; see README.md), then "make".
 * chime_init() sets PD2-PD7 as outputs, parks the ladder at mid-scale and starts timer 1, whose compare
 * interrupt writes one code per tick; the main loop plays the sound every two seconds.
 */
#include <util/delay.h>

#include "chime.h"

int main(void)
{
    chime_init();
    for (;;) {
        chime_play(CHIME_SOUND_CHIME);
        while (!chime_is_done()) {
        }
        _delay_ms(2000);
    }
}

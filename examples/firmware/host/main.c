/*
 * main.c: plays a Rungtone sound on the host through a mock port and checks every code, part of Rungtone's
 * firmware examples.
 *
 * Licence of this file: MIT. Permission is hereby granted, free of charge, to any person obtaining a copy
 * of this file, to deal in it without restriction, including without limitation the rights to use, copy,
 * modify, merge, publish, distribute, sublicense, and/or sell copies, in source or binary form (for example
 * inside closed firmware). THE FILE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND.
 *
 * Build the C files first (generic family, pins PA0-PA5, unpacked samples, name "chime"; see README.md), then
 * "make run". The port hook below stands in for a port register: it keeps the pins the player sets. The
 * program calls the tick as a timer interrupt would, prints the code on the pins after each tick, one per
 * line, and checks that the ladder rests at mid-scale before the sound, that the codes are the sample
 * table's, in order, and that after the sound the pins hold its last code. It exits 0 when every check passes.
 */
#include <stdio.h>

#include "chime.h"

static chime_port_t port_a;     /* the mock port register */
static unsigned long hook_calls;

void chime_port_write(uint8_t port, chime_port_t value, chime_port_t mask)
{
    if (port == CHIME_PORT_A) {
        port_a = (chime_port_t)((port_a & (chime_port_t)~mask) | (value & mask));
    }
    hook_calls++;
}

int main(void)
{
    unsigned long ticks = 0;
    unsigned long wrong = 0;
    unsigned long first = chime_sound_start[CHIME_SOUND_CHIME];
    unsigned long count = (unsigned long)chime_sound_end[CHIME_SOUND_CHIME] - first;

    chime_init();
    if ((port_a & CHIME_PORT_A_MASK) != CHIME_MID_CODE) {
        fprintf(stderr, "after init the ladder is at %u, not mid-scale %u\n", (unsigned)port_a, CHIME_MID_CODE);
        return 1;
    }
    chime_play(CHIME_SOUND_CHIME);
    while (!chime_is_done()) {
        unsigned code;
        chime_tick();
        code = (unsigned)(port_a & CHIME_PORT_A_MASK);
        printf("%u\n", code);
        if (ticks < count && code != chime_samples[first + ticks]) {
            wrong++;
        }
        ticks++;
        if (ticks > count + 1) {
            fprintf(stderr, "the sound did not end after %lu samples\n", count);
            return 1;
        }
    }
    chime_tick();
    if (count > 0 && (port_a & CHIME_PORT_A_MASK) != chime_samples[first + count - 1]) {
        fprintf(stderr, "after the sound the ladder is at %u, not its last code %u\n", (unsigned)port_a,
                (unsigned)chime_samples[first + count - 1]);
        return 1;
    }
    if (ticks != count || wrong != 0) {
        fprintf(stderr, "%lu ticks for %lu samples, %lu codes differ from the table\n", ticks, count, wrong);
        return 1;
    }
    fprintf(stderr, "ok: %lu samples at %u Hz played through the port hook (%lu calls), each the table's code\n",
            count, CHIME_TICK_RATE_HZ, hook_calls);
    return 0;
}

/*
 * Rungtone test harness: runs an AVR program (an ELF linked by avr-gcc for the ATmega328P at 16 MHz) in
 * simavr for a given number of CPU cycles and prints what the program does to the GPIO ports and how long
 * its interrupts take. Built by the firmware tests with the host gcc against libsimavr:
 *
 *     gcc -std=gnu99 -O2 -I/usr/include/simavr simavr-harness.c -lsimavr -o simavr-harness
 *     simavr-harness PLAYER.elf CYCLES [MCU]
 *
 * MCU is the simulated part, atmega328p unless given; the others the tests use (atmega644p, 64 KiB of
 * flash, for tables the 328P cannot hold) have ports B, C and D and GPIOR0 at the same addresses.
 *
 * Output on stdout, one record per line, as things happen (an isr line when the interrupt ends, after the
 * writes made inside it):
 *
 *     CYCLE REGISTER 0xVV   every write to PINx, DDRx or PORTx (x = B, C, D) and to GPIOR0, which the test
 *                           programs use as a marker between their phases. CYCLE is the cycle at which
 *                           the writing instruction starts.
 *     isr ENTRY CYCLES      one completed interrupt: ENTRY is the cycle of its first vector instruction,
 *                           CYCLES its length including the interrupt response (see below).
 *     summary interrupts N worst W mean M period-min A period-max B period-mean P
 *                           the last line: interrupt count, worst and mean length, and the spacing of
 *                           interrupt entries (the tick period) in cycles.
 *
 * Exit code 0 after CYCLES cycles; 2 for bad arguments or an unreadable ELF; 3 when the simulated program
 * crashed or stopped (sleep with interrupts off) before CYCLES.
 *
 * How the writes are seen: each watched register's write handler is wrapped. simavr's core calls the
 * handler of an IO address once for every write of an instruction to it, with the byte written; the
 * wrapper records the write and passes it on to the handler that was there (the port module's, which
 * updates the register and the pin state), or, where there is none (GPIOR0), stores the byte as the core
 * would. avr_register_io_write() cannot be used for this: simavr 1.6 shares an address
 * between at most four handlers in all, and the port module already owns all nine port registers. The IO
 * irqs (avr_iomem_getirq) are no substitute either: in simavr 1.6 they fire twice for a port write.
 *
 * How interrupts are timed: simavr raises the interrupt table's "running" irq (AVR_INT_IRQ_RUNNING) with
 * the vector number when it enters a vector, and again (with 0, or the vector of an interrupted one) when
 * a RETI executes. At entry the cycle counter already stands at the first vector instruction. At RETI it
 * still stands at the RETI's first cycle, so the end is read once that instruction has finished, after the
 * simulator step that ran it. simavr charges no cycles for the entry itself (it pushes the return address
 * and jumps without advancing the clock), so the harness adds the interrupt response of the datasheet: four
 * cycles to push the program counter and jump to the vector (ATmega328P datasheet, section "Interrupt
 * Response Time"). The firmware tests check this on a bare handler (ISR_NAKED, a lone RETI), which must
 * measure 4 + 3 (the JMP at the vector) + 4 (RETI) = 11 cycles. Not included: up to three cycles of
 * latency while a multi-cycle instruction of the interrupted code completes; with an idle loop (RJMP, two
 * cycles) that is at most one cycle.
 */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "sim_avr.h"
#include "sim_elf.h"
#include "sim_io.h"
#include "sim_interrupts.h"

#define DEFAULT_MCU "atmega328p"
#define CPU_HZ 16000000u
/* ATmega328P datasheet: interrupt response time, four clock cycles minimum. */
#define RESPONSE_CYCLES 4u

/* Data-space addresses, ATmega328P datasheet "Register Summary" (I/O address + 0x20). */
static const struct {
    uint16_t addr;
    const char *name;
} watched[] = {
    {0x23, "PINB"}, {0x24, "DDRB"}, {0x25, "PORTB"},
    {0x26, "PINC"}, {0x27, "DDRC"}, {0x28, "PORTC"},
    {0x29, "PIND"}, {0x2A, "DDRD"}, {0x2B, "PORTD"},
    {0x3E, "GPIOR0"},
};
#define WATCHED_COUNT (sizeof(watched) / sizeof(watched[0]))

static avr_t *avr;
/* The records go here; stdout itself carries simavr's own messages to stderr (see main). */
static FILE *out;

/* Interrupt bookkeeping: only one level deep (the players never nest interrupts). */
static int in_isr;
static avr_cycle_count_t isr_entry;
static int exit_pending;
static unsigned long isr_count;
static avr_cycle_count_t isr_worst;
static double isr_total;
static unsigned long entries;
static avr_cycle_count_t first_entry;
static avr_cycle_count_t last_entry;
static avr_cycle_count_t period_min = (avr_cycle_count_t)-1;
static avr_cycle_count_t period_max;

/* The write handler each watched register had before the harness wrapped it. */
static struct {
    avr_io_write_t handler;
    void *param;
} previous[WATCHED_COUNT];

/* Simulated time only: simavr's own sleep handler would wait in real time while the program sleeps. */
static void no_sleep(avr_t *core, avr_cycle_count_t cycles)
{
    (void)core;
    (void)cycles;
}

static void on_write(avr_t *core, avr_io_addr_t addr, uint8_t value, void *param)
{
    const size_t i = (size_t)(uintptr_t)param;
    fprintf(out, "%llu %s 0x%02x\n", (unsigned long long)core->cycle, watched[i].name, (unsigned)value);
    if (previous[i].handler != NULL) {
        previous[i].handler(core, addr, value, previous[i].param);
    } else {
        core->data[addr] = value;
    }
}

/* Ends the interrupt in progress at the current cycle (the first cycle after its RETI). */
static void finish_isr(void)
{
    const avr_cycle_count_t cycles = avr->cycle - isr_entry + RESPONSE_CYCLES;
    fprintf(out, "isr %llu %llu\n", (unsigned long long)isr_entry, (unsigned long long)cycles);
    if (cycles > isr_worst) {
        isr_worst = cycles;
    }
    isr_total += (double)cycles;
    isr_count++;
    in_isr = 0;
    exit_pending = 0;
}

static void on_running(struct avr_irq_t *irq, uint32_t value, void *param)
{
    (void)irq;
    (void)param;
    if (value != 0u) {
        if (exit_pending) {
            /* simavr entered the next vector in the same step as the RETI of the last one */
            finish_isr();
        }
        if (in_isr) {
            fprintf(stderr, "simavr-harness: nested interrupt at cycle %llu\n",
                    (unsigned long long)avr->cycle);
            exit(3);
        }
        if (entries == 0u) {
            first_entry = avr->cycle;
        } else {
            const avr_cycle_count_t period = avr->cycle - last_entry;
            if (period < period_min) {
                period_min = period;
            }
            if (period > period_max) {
                period_max = period;
            }
        }
        entries++;
        last_entry = avr->cycle;
        isr_entry = avr->cycle;
        in_isr = 1;
    } else if (in_isr) {
        exit_pending = 1;
    }
}

static void watch(void)
{
    size_t i;
    avr_irq_t *running;
    for (i = 0; i < WATCHED_COUNT; i++) {
        const avr_io_addr_t io = AVR_DATA_TO_IO(watched[i].addr);
        previous[i].handler = avr->io[io].w.c;
        previous[i].param = avr->io[io].w.param;
        avr->io[io].w.c = on_write;
        avr->io[io].w.param = (void *)(uintptr_t)i;
    }
    running = avr_get_interrupt_irq(avr, AVR_INT_ANY);
    if (running == NULL) {
        fprintf(stderr, "simavr-harness: no interrupt irq\n");
        exit(2);
    }
    running += AVR_INT_IRQ_RUNNING;
    running->flags &= (uint8_t)~IRQ_FLAG_FILTERED;
    avr_irq_register_notify(running, on_running, NULL);
}

int main(int argc, char **argv)
{
    elf_firmware_t fw;
    unsigned long long limit;
    char *end;
    const char *mcu = argc == 4 ? argv[3] : DEFAULT_MCU;
    if (argc != 3 && argc != 4) {
        fprintf(stderr, "usage: simavr-harness PROGRAM.elf CYCLES [MCU]\n");
        return 2;
    }
    limit = strtoull(argv[2], &end, 10);
    if (*end != '\0' || limit == 0u) {
        fprintf(stderr, "simavr-harness: CYCLES must be a positive number: %s\n", argv[2]);
        return 2;
    }
    /* simavr prints progress messages ("Loaded ... .text") with printf: send them to stderr. */
    fflush(stdout);
    out = fdopen(dup(STDOUT_FILENO), "w");
    if (out == NULL || dup2(STDERR_FILENO, STDOUT_FILENO) < 0) {
        perror("simavr-harness");
        return 2;
    }
    memset(&fw, 0, sizeof(fw));
    if (elf_read_firmware(argv[1], &fw) != 0) {
        fprintf(stderr, "simavr-harness: cannot read %s\n", argv[1]);
        return 2;
    }
    if (strlen(mcu) >= sizeof(fw.mmcu)) {
        fprintf(stderr, "simavr-harness: MCU name too long: %s\n", mcu);
        return 2;
    }
    strcpy(fw.mmcu, mcu);
    fw.frequency = CPU_HZ;
    avr = avr_make_mcu_by_name(fw.mmcu);
    if (avr == NULL) {
        fprintf(stderr, "simavr-harness: simavr has no %s\n", mcu);
        return 2;
    }
    avr_init(avr);
    avr->log = LOG_ERROR;
    avr_load_firmware(avr, &fw);
    avr->frequency = CPU_HZ;
    avr->sleep = no_sleep;
    watch();

    while (avr->cycle < limit) {
        const int state = avr_run(avr);
        if (exit_pending) {
            finish_isr();
        }
        if (state == cpu_Done || state == cpu_Crashed) {
            fprintf(stderr, "simavr-harness: program %s at cycle %llu (pc 0x%04x)\n",
                    state == cpu_Crashed ? "crashed" : "stopped", (unsigned long long)avr->cycle,
                    (unsigned)avr->pc);
            return 3;
        }
    }
    fprintf(out, "summary interrupts %lu worst %llu mean %.2f period-min %llu period-max %llu"
            " period-mean %.3f\n", isr_count, (unsigned long long)isr_worst,
            isr_count ? isr_total / (double)isr_count : 0.0,
            (unsigned long long)(entries > 1u ? period_min : 0u), (unsigned long long)period_max,
            entries > 1u ? (double)(last_entry - first_entry) / (double)(entries - 1u) : 0.0);
    fflush(out);
    avr_terminate(avr);
    return 0;
}

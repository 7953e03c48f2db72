/*
 * startup.c: the vector table and reset handler of the Cortex-M example of Rungtone's firmware examples, for an
 * STM32F4-class part (see stm32f4.ld); no vendor files and no C library.
 *
 * Licence of this file: MIT. Permission is hereby granted, free of charge, to any person obtaining a copy
 * of this file, to deal in it without restriction, including without limitation the rights to use, copy,
 * modify, merge, publish, distribute, sublicense, and/or sell copies, in source or binary form (for example
 * inside closed firmware). THE FILE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND.
 *
 * The reset handler copies initialised data from flash to RAM, clears the rest, and calls main(). The player's
 * SysTick_Handler takes the SysTick entry; a player built with --timer general16 or general32 names its
 * handler chime_IRQHandler: put it in the entry of that timer's interrupt (TIM3 or TIM2 below, the defaults).
 */
#include <stdint.h>

extern uint32_t _estack;
extern uint32_t _sidata;
extern uint32_t _sdata;
extern uint32_t _edata;
extern uint32_t _sbss;
extern uint32_t _ebss;

int main(void);
void Reset_Handler(void);
void Default_Handler(void);
void SysTick_Handler(void) __attribute__((weak, alias("Default_Handler")));
void TIM2_IRQHandler(void) __attribute__((weak, alias("Default_Handler")));
void TIM3_IRQHandler(void) __attribute__((weak, alias("Default_Handler")));

/** One vector: the initial stack pointer or a handler. */
typedef union {
    void (*handler)(void);
    uint32_t *stack;
} vector_t;

/* Cortex-M exceptions 0-15, then the STM32F4's interrupts 0-29 (TIM2 is 28, TIM3 is 29). */
__attribute__((section(".isr_vector"), used)) const vector_t vector_table[16 + 30] = {
    [0] = {.stack = &_estack},
    [1] = {.handler = Reset_Handler},
    [2] = {.handler = Default_Handler},   /* NMI */
    [3] = {.handler = Default_Handler},   /* HardFault */
    [4] = {.handler = Default_Handler},   /* MemManage */
    [5] = {.handler = Default_Handler},   /* BusFault */
    [6] = {.handler = Default_Handler},   /* UsageFault */
    [11] = {.handler = Default_Handler},  /* SVCall */
    [14] = {.handler = Default_Handler},  /* PendSV */
    [15] = {.handler = SysTick_Handler},
    [16 + 28] = {.handler = TIM2_IRQHandler},
    [16 + 29] = {.handler = TIM3_IRQHandler},
};

void Reset_Handler(void)
{
    /* volatile: the compiler must not turn these loops into calls of memcpy and memset, which are absent */
    volatile uint32_t *dst = &_sdata;
    const volatile uint32_t *src = &_sidata;
    while (dst < &_edata) {
        *dst++ = *src++;
    }
    for (dst = &_sbss; dst < &_ebss; dst++) {
        *dst = 0u;
    }
    (void)main();
    for (;;) {
    }
}

void Default_Handler(void)
{
    for (;;) {
    }
}

/**
 * The command line: picocli commands that map options to settings, call the stages and print results.
 * No computation lives here; this is the only package that writes to stdout/stderr.
 */
package org.rungtone.cli;

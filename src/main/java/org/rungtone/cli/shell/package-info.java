/**
 * Where the command line meets the user's shell and terminal: completion scripts for bash, zsh and fish read
 * from the command model, help that fits the terminal and lists options under headings, "did you mean"
 * for a mistyped option or command, and the progress line on a terminal's standard error. It may use
 * picocli; the commands themselves stay in {@code org.rungtone.cli}, which uses this package and is never
 * used by it.
 */
package org.rungtone.cli.shell;

/**
 * The {@code .rung} waveform-script language: {@link org.rungtone.script.RungScript} parses, checks and renders
 * scripts to signals, and every problem in a script is a {@link org.rungtone.script.ScriptError} with file,
 * line, column and a caret excerpt. The grammar lives in {@code src/main/javacc/rung.jj}; the syntax tree is in
 * {@code script.ast} and the block evaluators in {@code script.eval}.
 */
package org.rungtone.script;

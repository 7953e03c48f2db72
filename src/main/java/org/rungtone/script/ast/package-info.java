/**
 * The syntax tree of {@code .rung} scripts: immutable records built by the generated parser through
 * {@link org.rungtone.script.ast.Ast}, literal rules (unit suffixes, decibels, note names), name suggestions
 * and the s-expression form used by tests. Not API: {@code org.rungtone.script.RungScript} is the facade.
 */
package org.rungtone.script.ast;

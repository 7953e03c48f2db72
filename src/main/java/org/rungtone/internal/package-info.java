/**
 * Small checks and helpers shared by the stages: argument checks, the input-error type, unit parsing and
 * atomic file writes. Not API: anything here may change without notice.
 */
package org.rungtone.internal;

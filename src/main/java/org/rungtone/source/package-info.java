/**
 * Where sound enters Rungtone: WAV decoding of every common PCM and float layout, the {@link
 * org.rungtone.source.Signal} value every later stage consumes, and the WAV writer used for previews.
 */
package org.rungtone.source;

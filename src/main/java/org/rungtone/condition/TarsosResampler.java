package org.rungtone.condition;

import org.rungtone.internal.Checks;
import org.rungtone.source.Signal;

/**
 * TarsosDSP's band-limited resampler (a port of Julius Smith's resample library) in its high-quality mode:
 * fast and good to about 70 dB of stopband, enough for targets up to about 10 bits.
 */
public final class TarsosResampler implements Resampler {
    @Override
    public String name() {
        return "TarsosDSP band-limited";
    }

    @Override
    public Signal resample(Signal signal, double targetRateHz) {
        Checks.checkArgument(Double.isFinite(targetRateHz) && targetRateHz > 0,
                "target rate must be positive: %s", targetRateHz);
        double fin = signal.sampleRateHz();
        if (fin == targetRateHz) {
            return signal;
        }
        double factor = targetRateHz / fin;
        double[] x = signal.unsafeSamples();
        float[] in = new float[x.length];
        for (int i = 0; i < x.length; i++) {
            in[i] = (float) x[i];
        }
        int outLen = (int) Math.ceil(x.length * factor - 1e-9);
        float[] out = new float[outLen + 16];
        be.tarsos.dsp.resample.Resampler r = new be.tarsos.dsp.resample.Resampler(true, factor, factor);
        int consumed = 0;
        int produced = 0;
        while (produced < outLen) {
            be.tarsos.dsp.resample.Resampler.Result res = r.process(factor, in, consumed, in.length - consumed,
                    true, out, produced, out.length - produced);
            consumed += res.inputSamplesConsumed;
            produced += res.outputSamplesGenerated;
            if (res.outputSamplesGenerated == 0 && res.inputSamplesConsumed == 0) {
                break;
            }
        }
        double[] y = new double[outLen];
        for (int i = 0; i < Math.min(outLen, produced); i++) {
            y[i] = out[i];
        }
        return Signal.wrap(y, targetRateHz);
    }
}

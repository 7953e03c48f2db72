package org.rungtone.ladder;

import java.util.SplittableRandom;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;

/**
 * How Monte Carlo draws a resistor's deviation from its nominal value: uniform within ± the tolerance (the
 * default; nothing is known about the maker's binning), or Gaussian with a stated relative sigma (the
 * tolerance is then not used and values are not truncated).
 *
 * @param kind uniform or Gaussian
 * @param sigma relative standard deviation of a Gaussian draw (0.01 for 1 %); 0 for uniform
 */
public record Spread(Kind kind, double sigma) {
    /** The shape of the distribution. */
    public enum Kind {
        /** Uniform in [−tolerance, +tolerance]. */
        UNIFORM,
        /** Normal with mean 0 and the stated sigma. */
        GAUSSIAN
    }

    /** Checks sigma. */
    public Spread {
        Checks.checkArgument(kind != null, "kind is required");
        Checks.checkArgument(Double.isFinite(sigma) && sigma >= 0 && sigma <= 0.5,
                "sigma must be 0..50%%: %s", sigma);
    }

    /** Uniform within the tolerance. */
    public static Spread uniform() {
        return new Spread(Kind.UNIFORM, 0);
    }

    /** Gaussian with relative sigma {@code sigma}. */
    public static Spread gaussian(double sigma) {
        return new Spread(Kind.GAUSSIAN, sigma);
    }

    /**
     * A Gaussian spread from the user's text: a percentage with its % sign, above 0 and at most 50 %.
     *
     * @throws InputError when the text is not such a percentage; the caller names where it came from
     */
    public static Spread parseGaussian(String sigmaPercent) {
        if (!sigmaPercent.trim().endsWith("%")) {
            throw new InputError("write it as a percentage, e.g. 1.7%");
        }
        double sigma = Units.parse(sigmaPercent, "%");
        if (!(sigma > 0) || Double.isInfinite(sigma)) {
            throw new InputError("must be a positive value, got " + sigmaPercent);
        }
        if (sigma > 0.5) {
            throw new InputError("must be at most 50%, got " + sigmaPercent);
        }
        return gaussian(sigma);
    }

    /** One relative deviation: the value is {@code nominal · (1 + deviation)}. */
    public double deviation(SplittableRandom random, double tolerance) {
        if (kind == Kind.UNIFORM) {
            return tolerance * (2 * random.nextDouble() - 1);
        }
        return sigma * random.nextGaussian();
    }

    /** A short description: "uniform within ±5%" or "gaussian, sigma 1.7%". */
    public String describe(double tolerance) {
        return kind == Kind.UNIFORM
                ? "uniform within ±" + SpecChecks.percent(tolerance)
                : "gaussian, sigma " + SpecChecks.percent(sigma);
    }
}

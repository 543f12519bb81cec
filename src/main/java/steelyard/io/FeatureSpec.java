package steelyard.io;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A score column used as a feature, with the convention that turns its raw value into a natural-log score
 * where higher is better.
 *
 * <p>Syntax: {@code NAME[:CONVENTION][:scale=S]}, conventions {@code ln} (default), {@code log10},
 * {@code cost} (lower is better: negated), {@code linear} (a probability or a confidence: its natural log is
 * taken after scaling). The scale multiplies the raw value first. Examples: {@code acoustic},
 * {@code acoustic:log10}, {@code decoder_cost:cost}, {@code mean_word_conf:linear:scale=0.01},
 * {@code raw:scale=0.0001} (an integer log in base 1.0001 is roughly raw·1e-4 in natural log;
 * use {@code scale=0.000099995} for the exact ln 1.0001).
 *
 * @param name       column name in the hypotheses file
 * @param convention how the raw value is read
 * @param scale      multiplier applied to the raw value before the convention (1 by default)
 */
public record FeatureSpec(String name, Convention convention, double scale) {

  /** How a raw column value maps to a natural-log, higher-is-better score. */
  public enum Convention {
    /** Already a natural log, higher is better. */
    LN,
    /** Base-10 log, higher is better: multiplied by ln 10. */
    LOG10,
    /** A cost, lower is better (e.g. a negated natural-log score): negated. */
    COST,
    /** A probability or confidence in (0, 1] after scaling: its natural log; 0 gives −∞ and is clamped. */
    LINEAR
  }

  /** Natural log of the smallest positive value a {@link Convention#LINEAR} column may take: ln(1e-10). */
  public static final double LINEAR_FLOOR_LN = Math.log(1e-10);

  public FeatureSpec {
    if (name == null || name.isBlank()) throw new IllegalArgumentException("feature name is empty");
    if (!(scale > 0 || scale < 0) || !Double.isFinite(scale))
      throw new IllegalArgumentException("scale must be finite and non-zero: " + scale);
  }

  /** Converts one raw (finite) column value to a natural-log score, higher is better. */
  public double toNaturalLog(double raw) {
    double v = raw * scale;
    switch (convention) {
      case LN: return v;
      case LOG10: return v * Math.log(10);
      case COST: return -v;
      case LINEAR: return v <= 0 ? LINEAR_FLOOR_LN : Math.max(LINEAR_FLOOR_LN, Math.log(v));
      default: throw new AssertionError(convention);
    }
  }

  /** Parses one spec such as {@code mean_word_conf:linear:scale=0.01}. */
  public static FeatureSpec parse(String spec) {
    String[] parts = spec.trim().split(":", -1);
    String name = parts[0].trim();
    if (name.isEmpty()) throw InputException.option("--features", "empty feature name in '" + spec + "'", "NAME[:ln|log10|cost|linear][:scale=S]");
    Convention convention = Convention.LN;
    double scale = 1.0;
    for (int i = 1; i < parts.length; i++) {
      String p = parts[i].trim().toLowerCase(Locale.ROOT);
      if (p.startsWith("scale=")) {
        scale = parseScale(spec, p.substring("scale=".length()));
      } else {
        convention = parseConvention(spec, p);
      }
    }
    return new FeatureSpec(name, convention, scale);
  }

  /** Parses a comma-separated list; an empty or null string gives an empty list. */
  public static List<FeatureSpec> parseList(String specs) {
    List<FeatureSpec> out = new ArrayList<>();
    if (specs == null || specs.isBlank()) return out;
    for (String s : specs.split(",")) {
      if (!s.isBlank()) out.add(parse(s));
    }
    return out;
  }

  @Override
  public String toString() {
    String s = name + ":" + convention.name().toLowerCase(Locale.ROOT);
    return scale == 1.0 ? s : s + ":scale=" + scale;
  }

  private static Convention parseConvention(String spec, String p) {
    switch (p) {
      case "ln": case "natural": return Convention.LN;
      case "log10": return Convention.LOG10;
      case "cost": return Convention.COST;
      case "linear": return Convention.LINEAR;
      default:
        throw InputException.option("--features", "unknown convention '" + p + "' in '" + spec + "'", "ln, log10, cost, linear or scale=S");
    }
  }

  private static double parseScale(String spec, String value) {
    try {
      double s = Double.parseDouble(value);
      if (Double.isFinite(s) && s != 0) return s;
    } catch (NumberFormatException e) {
      // reported below
    }
    throw InputException.option("--features", "bad scale '" + value + "' in '" + spec + "'", "a finite non-zero number");
  }
}

package steelyard.io;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

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
    /**
     * A probability or confidence ≥ 0 after scaling: its natural log, at least {@link #LINEAR_FLOOR_LN} (0 gives
     * the floor); a negative value has no logarithm and is refused ({@link #rawProblem}).
     */
    LINEAR
  }

  /** Natural log of the smallest positive value a {@link Convention#LINEAR} column may take: ln(1e-10). */
  public static final double LINEAR_FLOOR_LN = Math.log(1e-10);

  public FeatureSpec {
    if (name == null || name.isBlank()) throw new IllegalArgumentException("feature name is empty");
    if (!(scale > 0 || scale < 0) || !Double.isFinite(scale))
      throw new IllegalArgumentException("scale must be finite and non-zero: " + scale);
  }

  /** Converts one raw (finite) column value to a natural-log score, higher is better; NaN when {@link #rawProblem} objects. */
  public double toNaturalLog(double raw) {
    double v = raw * scale;
    switch (convention) {
      case LN: return v;
      case LOG10: return v * Math.log(10);
      case COST: return -v;
      case LINEAR: return v < 0 ? Double.NaN : v == 0 ? LINEAR_FLOOR_LN : Math.max(LINEAR_FLOOR_LN, Math.log(v));
      default: throw new AssertionError(convention);
    }
  }

  /**
   * Why the raw value {@code raw} cannot be converted, or null when it can: a {@link Convention#LINEAR} value
   * that is negative after scaling has no logarithm (it is refused, never clamped).
   */
  public String rawProblem(double raw) {
    if (convention == Convention.LINEAR && raw * scale < 0)
      return "is negative, but " + name + ":linear takes the natural log of a probability or confidence";
    return null;
  }

  /**
   * Parses one spec such as {@code mean_word_conf:linear:scale=0.01}. At most one convention and one scale;
   * a negative scale is refused with {@code linear} (it would make every confidence negative).
   */
  public static FeatureSpec parse(String spec) {
    String[] parts = spec.trim().split(":", -1);
    String name = parts[0].trim();
    if (name.isEmpty()) throw InputException.option("--features", "empty feature name in '" + spec + "'", SYNTAX);
    Convention convention = null;
    Double scale = null;
    for (int i = 1; i < parts.length; i++) {
      String p = parts[i].trim().toLowerCase(Locale.ROOT);
      if (p.startsWith("scale=")) {
        if (scale != null) throw repeated(spec, "scale");
        scale = parseScale(spec, p.substring("scale=".length()));
      } else {
        if (convention != null) throw repeated(spec, "convention");
        convention = parseConvention(spec, p);
      }
    }
    if (convention == Convention.LINEAR && scale != null && scale < 0)
      throw InputException.option("--features", "negative scale " + scale + " with :linear in '" + spec + "'",
          "a positive scale for a probability or confidence column");
    return new FeatureSpec(name, convention == null ? Convention.LN : convention, scale == null ? 1.0 : scale);
  }

  /**
   * Parses the value of the {@code --features} option: null (the option not given) gives an empty list; an
   * empty value ({@code --features ""}) is an {@link InputException}, since it is almost always a shell
   * variable that was not set; otherwise as {@link #parseList}.
   */
  public static List<FeatureSpec> parseOption(String specs) {
    if (specs != null && specs.isBlank())
      throw InputException.option("--features", "the list is empty", "one or more score columns such as acoustic,lm (or leave the option out)");
    return parseList(specs);
  }

  /**
   * Parses a comma-separated list; null or an empty string gives an empty list. An empty entry ({@code ,} or
   * {@code a,,b}) and a column named twice are {@link InputException}s.
   */
  public static List<FeatureSpec> parseList(String specs) {
    List<FeatureSpec> out = new ArrayList<>();
    if (specs == null || specs.isEmpty()) return out;
    Set<String> names = new HashSet<>();
    for (String s : specs.split(",", -1)) {
      if (s.isBlank()) throw InputException.option("--features", "empty entry in '" + specs + "'", "column specs separated by single commas, such as acoustic,lm");
      FeatureSpec f = parse(s);
      if (!names.add(f.name()))
        throw InputException.option("--features", "column '" + f.name() + "' is listed twice in '" + specs + "'", "each score column once");
      out.add(f);
    }
    return out;
  }

  @Override
  public String toString() {
    String s = name + ":" + convention.name().toLowerCase(Locale.ROOT);
    return scale == 1.0 ? s : s + ":scale=" + scale;
  }

  private static final String SYNTAX = "NAME[:ln|log10|cost|linear][:scale=S]";

  private static InputException repeated(String spec, String what) {
    return InputException.option("--features", "more than one " + what + " in '" + spec + "'", "at most one convention and one scale per column: " + SYNTAX);
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

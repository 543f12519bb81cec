package steelyard.lm;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * The human-readable {@code key=value} metadata lines a model carries (ARPA: comment lines before
 * {@code \data\}; binary: a string block). Keys read back: {@code steelyard.unit} ({@code word}|{@code char})
 * and {@code steelyard.normalisation.fold_case|strip_punct|split_hyphens|ignore_space} ({@code true}|{@code false});
 * unknown keys and free text are kept but do not change behaviour. Missing keys mean word unit and
 * {@link NormalisationOptions#EXACT}. {@link #minCounts} reads the training's per-order minimum counts,
 * {@code steelyard.min_count.K=C}, and the older single line {@value #CUTOFFS_V1}{@code =C1,C2,…} (count
 * cut-offs: n-grams seen at most Ck times dropped, the last value repeating) that 0.1 wrote.
 */
public final class ModelMetadata {
  public static final String UNIT = "steelyard.unit";
  public static final String FOLD_CASE = "steelyard.normalisation.fold_case";
  public static final String STRIP_PUNCT = "steelyard.normalisation.strip_punct";
  public static final String SPLIT_HYPHENS = "steelyard.normalisation.split_hyphens";
  public static final String IGNORE_SPACE = "steelyard.normalisation.ignore_space";
  /** Prefix of the per-order minimum counts: {@code steelyard.min_count.2=2}. */
  public static final String MIN_COUNT = "steelyard.min_count.";
  /** The cut-off line written by release 0.1, still read: {@code none} or {@code C1,C2,…}. */
  public static final String CUTOFFS_V1 = "steelyard.cutoffs";

  private ModelMetadata() {}

  /** A builder whose unit and normalisation come from {@code lines} (metadata not yet added to it). */
  public static BackoffModel.Builder builder(int order, List<String> lines) {
    return new BackoffModel.Builder(order, unit(lines), normalisation(lines));
  }

  /** The unit recorded in {@code lines}; word when absent or unrecognised. */
  public static Unit unit(List<String> lines) {
    String v = value(lines, UNIT);
    return v != null && v.equalsIgnoreCase("char") ? Unit.CHAR : Unit.WORD;
  }

  /** The normalisation recorded in {@code lines} (no rules file: a rules path is machine-specific). */
  public static NormalisationOptions normalisation(List<String> lines) {
    return new NormalisationOptions(flag(lines, FOLD_CASE), flag(lines, STRIP_PUNCT), flag(lines, SPLIT_HYPHENS), flag(lines, IGNORE_SPACE), null);
  }

  /**
   * The lines to write for {@code model}: its own metadata, preceded by unit and normalisation lines derived
   * from the model when its metadata does not already state them.
   */
  public static List<String> linesFor(LanguageModel model, List<String> metadata) {
    List<String> out = new ArrayList<>();
    if (value(metadata, UNIT) == null) out.add(UNIT + "=" + model.unit().name().toLowerCase(Locale.ROOT));
    NormalisationOptions n = model.normalisation();
    addFlag(out, metadata, FOLD_CASE, n.foldCase());
    addFlag(out, metadata, STRIP_PUNCT, n.stripPunctuation());
    addFlag(out, metadata, SPLIT_HYPHENS, n.splitHyphens());
    addFlag(out, metadata, IGNORE_SPACE, n.ignoreWhitespace());
    out.addAll(metadata);
    return out;
  }

  /**
   * The minimum count of every order 1 … {@code order} (index k−1) recorded at training, or null when the lines
   * record none (a model from elsewhere) or a value is not a count. From 0.1's cut-off line, a cut-off C is
   * the minimum count C + 1.
   */
  public static int[] minCounts(List<String> lines, int order) {
    int[] m = new int[order];
    boolean any = false;
    for (int k = 1; k <= order; k++) {
      String v = value(lines, MIN_COUNT + k);
      if (v != null) any = true;
      m[k - 1] = v == null ? 1 : count(v);
      if (m[k - 1] < 1) return null;
    }
    if (any) return m;
    String legacy = value(lines, CUTOFFS_V1);
    if (legacy == null) return null;
    Arrays.fill(m, 1);
    if (legacy.equals("none")) return m;
    String[] cut = legacy.split(",");
    for (int k = 1; k <= order; k++) {
      int c = count(cut[Math.min(k, cut.length) - 1].strip());
      if (c < 0 || c == Integer.MAX_VALUE) return null;
      m[k - 1] = c + 1;
    }
    return m;
  }

  private static int count(String s) {
    try {
      return Integer.parseInt(s);
    } catch (NumberFormatException e) {
      return -1;
    }
  }

  /** The value of {@code key} in {@code key=value} lines (last one wins), or null. */
  public static String value(List<String> lines, String key) {
    String found = null;
    for (String line : lines) {
      int eq = line.indexOf('=');
      if (eq > 0 && line.substring(0, eq).strip().equals(key)) found = line.substring(eq + 1).strip();
    }
    return found;
  }

  private static boolean flag(List<String> lines, String key) {
    String v = value(lines, key);
    return v != null && v.equalsIgnoreCase("true");
  }

  private static void addFlag(List<String> out, List<String> metadata, String key, boolean value) {
    if (value(metadata, key) == null) out.add(key + "=" + value);
  }
}

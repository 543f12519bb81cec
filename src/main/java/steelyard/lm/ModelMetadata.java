package steelyard.lm;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * The human-readable {@code key=value} metadata lines a model carries (ARPA: comment lines before
 * {@code \data\}; binary: a string block). Keys read back: {@code steelyard.unit} ({@code word}|{@code char})
 * and {@code steelyard.normalisation.fold_case|strip_punct|split_hyphens|ignore_space} ({@code true}|{@code false});
 * unknown keys and free text are kept but do not change behaviour. Missing keys mean word unit and
 * {@link NormalisationOptions#EXACT}.
 */
public final class ModelMetadata {
  public static final String UNIT = "steelyard.unit";
  public static final String FOLD_CASE = "steelyard.normalisation.fold_case";
  public static final String STRIP_PUNCT = "steelyard.normalisation.strip_punct";
  public static final String SPLIT_HYPHENS = "steelyard.normalisation.split_hyphens";
  public static final String IGNORE_SPACE = "steelyard.normalisation.ignore_space";

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

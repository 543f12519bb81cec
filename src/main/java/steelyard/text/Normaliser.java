package steelyard.text;

import it.unimi.dsi.fastutil.booleans.BooleanArrayList;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.text.Normalizer;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.concurrent.atomic.LongAdder;
import java.util.zip.CRC32;

/**
 * Turns raw transcript text into the token sequence that scoring and language models see.
 *
 * <p>Pipeline, in order: NFKC (Unicode Standard Annex #15); case folding ({@link Locale#ROOT} lower case);
 * punctuation stripping (general categories P*: an apostrophe is punctuation, so {@code o'clock} becomes
 * {@code oclock}); hyphen splitting (a run of Pd dashes between two characters that are neither whitespace
 * nor punctuation separates words: {@code cold-store} → {@code cold store}; splitting is decided on the
 * text before stripping, so the two options together still give {@code cold store}); whitespace
 * tokenisation into words (any Unicode whitespace; runs count once); user rules (dropped phrases vanish
 * first, then equivalences map a phrase to its canonical form and optionally-deletable phrases are kept
 * but flagged so alignment never counts them as an error whether present or absent; see {@link RulesFile}).
 * When stripping or folding leaves a word that is no longer NFKC (a combining mark meeting a new base
 * letter), the steps run again, so the output is a fixed point: normalising the joined output gives the
 * same tokens (with rules too, unless two multi-word phrases overlap: rule output is not matched again).
 *
 * <p>At {@link Unit#CHAR} the resulting words are split into extended grapheme clusters ({@code \X},
 * Unicode Standard Annex #29) with one {@link #SPACE_TOKEN} between words (none at the ends), or none at
 * all when whitespace is ignored. The characters of an optional word are optional; so is a space token
 * that deleting the optional words would also remove: the one before an optional word, and the one after
 * a leading run of optional words. Dropped words vanish with their space.
 *
 * <p>Immutable once built; thread-safe. Rule usage counts are kept per instance in {@link LongAdder}s.
 */
public final class Normaliser {
  /** The visible token that stands for a run of whitespace at character level. */
  public static final String SPACE_TOKEN = "<sp>";

  /** Guards against a pathological input that never settles; real text settles in one or two passes. */
  private static final int MAX_PASSES = 4;

  private final NormalisationOptions options;
  private final RuleSet rules;
  private final LongAdder[] counts;

  private Normaliser(NormalisationOptions options, RuleSet rules) {
    this.options = options;
    this.rules = rules;
    this.counts = new LongAdder[rules.rules().size()];
    for (int i = 0; i < counts.length; i++) counts[i] = new LongAdder();
  }

  /** Builds a normaliser; reads the rules file when one is given (bad rules: {@code InputException}). */
  public static Normaliser create(NormalisationOptions options) {
    Objects.requireNonNull(options, "options");
    if (options.rulesFile() == null) return new Normaliser(options, RuleSet.NONE);
    return create(options, RulesFile.read(options.rulesFile()));
  }

  /**
   * Builds a normaliser from rules already parsed (e.g. by {@link RulesFile#parse}); the options' rules
   * file is not read, it only labels errors.
   */
  public static Normaliser create(NormalisationOptions options, List<RulesFile.Rule> parsedRules) {
    Normaliser base = new Normaliser(options, RuleSet.NONE);
    return new Normaliser(options, RuleSet.compile(parsedRules, base::words, options.rulesFile()));
  }

  /** A normaliser with the same options and rules whose rule usage counts start again at zero. */
  public Normaliser withFreshCounts() {
    return new Normaliser(options, rules);
  }

  public NormalisationOptions options() {
    return options;
  }

  /**
   * A one-line, stable description of what this normaliser does, for recording in model files and
   * reports and for comparing two set-ups: {@code nfkc}, then each option that is on
   * ({@code fold-case strip-punct split-hyphens ignore-space}), then {@code rules=NAME#CRC} with the rules
   * file's name and the CRC-32 (8 hex digits) of its rule lines (comments and blank lines excluded), e.g.
   * {@code nfkc fold-case strip-punct rules=warehouse.rules#5d41a3b2}.
   */
  public String describe() {
    StringBuilder sb = new StringBuilder("nfkc");
    if (options.foldCase()) sb.append(" fold-case");
    if (options.stripPunctuation()) sb.append(" strip-punct");
    if (options.splitHyphens()) sb.append(" split-hyphens");
    if (options.ignoreWhitespace()) sb.append(" ignore-space");
    if (options.rulesFile() != null) {
      CRC32 crc = new CRC32();
      for (RulesFile.Rule r : rules.rules()) crc.update((r.text() + "\n").getBytes(StandardCharsets.UTF_8));
      Path name = options.rulesFile().getFileName();
      sb.append(" rules=").append(name == null ? options.rulesFile() : name)
          .append('#').append(String.format(Locale.ROOT, "%08x", crc.getValue()));
    }
    return sb.toString();
  }

  /** Normalised tokens of {@code raw} (not null; may be empty) in the given unit, with optionally-deletable flags. */
  public TokenSequence tokens(String raw, Unit unit) {
    if (unit == Unit.WORD && rules.isEmpty()) {
      List<String> words = words(raw);
      return new TokenSequence(words, new boolean[words.size()]);
    }
    List<String> out = new ArrayList<>();
    BooleanArrayList optional = new BooleanArrayList();
    tokensInto(raw, unit, out, optional);
    return new TokenSequence(out, optional.toBooleanArray());
  }

  /** Normalised tokens of {@code raw} in the given unit (optional flags dropped: for language models). */
  public List<String> tokenList(String raw, Unit unit) {
    List<String> out = new ArrayList<>();
    tokensInto(raw, unit, out, new BooleanArrayList());
    return Collections.unmodifiableList(out);
  }

  /**
   * Appends the tokens of {@code raw} to {@code out} and one flag per token to {@code optional}: the
   * allocation-light form of {@link #tokens} for callers that reuse their lists.
   */
  public void tokensInto(String raw, Unit unit, List<String> out, BooleanArrayList optional) {
    List<String> words = words(raw);
    if (unit == Unit.WORD) {
      applyRules(words, out, optional);
      return;
    }
    List<String> ruled = new ArrayList<>(words.size());
    BooleanArrayList flags = new BooleanArrayList(words.size());
    applyRules(words, ruled, flags);
    splitCharacters(ruled, flags, out, optional);
  }

  /** How many words each rule has touched so far (empty without a rules file). */
  public RuleUsage ruleUsage() {
    List<RulesFile.Rule> list = rules.rules();
    List<RuleUsage.RuleCount> out = new ArrayList<>(list.size());
    for (int i = 0; i < list.size(); i++) {
      RulesFile.Rule r = list.get(i);
      out.add(new RuleUsage.RuleCount(r.line(), r.kind(), r.text(), counts[i].sum()));
    }
    return new RuleUsage(out);
  }

  /**
   * Text for tokens of the given unit: words joined with single spaces; characters concatenated, with each
   * {@link #SPACE_TOKEN} written as one space. Normalising the result gives the tokens back.
   */
  public static String join(List<String> tokens, Unit unit) {
    if (unit == Unit.WORD) return String.join(" ", tokens);
    StringBuilder sb = new StringBuilder(tokens.size() + 8);
    for (String t : tokens) sb.append(SPACE_TOKEN.equals(t) ? " " : t);
    return sb.toString();
  }

  /**
   * The words of {@code raw} after every step before the rules (NFKC, case, punctuation, hyphens,
   * whitespace).
   */
  public List<String> words(String raw) {
    String s = raw;
    boolean ascii = isAscii(s);
    if (!ascii && !Normalizer.isNormalized(s, Normalizer.Form.NFKC)) s = Normalizer.normalize(s, Normalizer.Form.NFKC);
    if (options.foldCase()) s = s.toLowerCase(Locale.ROOT);
    List<String> words = WordSplitter.split(s, options.stripPunctuation(), options.splitHyphens());
    for (int pass = 1; !ascii && pass < MAX_PASSES && !settled(words); pass++) {
      s = Normalizer.normalize(String.join(" ", words), Normalizer.Form.NFKC);
      if (options.foldCase()) s = s.toLowerCase(Locale.ROOT);
      words = WordSplitter.split(s, options.stripPunctuation(), options.splitHyphens());
    }
    return words;
  }

  private boolean settled(List<String> words) {
    for (String w : words) {
      if (isAscii(w)) continue;
      if (!Normalizer.isNormalized(w, Normalizer.Form.NFKC)) return false;
      if (options.foldCase() && !w.toLowerCase(Locale.ROOT).equals(w)) return false;
    }
    return true;
  }

  private void applyRules(List<String> words, List<String> out, BooleanArrayList optional) {
    if (rules.isEmpty()) {
      out.addAll(words);
      optional.size(optional.size() + words.size());
      return;
    }
    rules.apply(words, out, optional, counts);
  }

  private void splitCharacters(List<String> words, BooleanArrayList flags, List<String> out, BooleanArrayList optional) {
    boolean space = !options.ignoreWhitespace();
    boolean allOptionalSoFar = true;
    for (int k = 0; k < words.size(); k++) {
      boolean flag = flags.getBoolean(k);
      if (space && k > 0) {
        out.add(SPACE_TOKEN);
        optional.add(flag || allOptionalSoFar);
      }
      int before = out.size();
      Graphemes.addTo(words.get(k), out);
      for (int i = before; i < out.size(); i++) optional.add(flag);
      allOptionalSoFar &= flag;
    }
  }

  private static boolean isAscii(String s) {
    for (int i = 0, n = s.length(); i < n; i++) if (s.charAt(i) >= 0x80) return false;
    return true;
  }
}

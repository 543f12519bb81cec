package steelyard.text;

import it.unimi.dsi.fastutil.booleans.BooleanArrayList;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.LongAdder;
import java.util.function.Function;
import steelyard.io.InputException;

/**
 * The rules of a rules file compiled for matching: every phrase normalised with the normaliser's own
 * options, indexed by its first word.
 *
 * <p>Storage: a {@link HashMap} from first word to an array of entries (longest phrase first); one entry
 * per distinct phrase (about 100 bytes plus its strings). Matching is greedy left to right, longest phrase
 * first; the output of a rule is not matched again. Immutable and thread-safe; the counters live in the
 * normaliser.
 */
final class RuleSet {
  static final RuleSet NONE = new RuleSet(List.of(), Map.of(), Map.of());

  /** A normalised phrase and what to do with it. */
  private static final class Entry {
    final String[] words;
    final RuleKind kind;
    final int rule;
    /** EQUATE only: the canonical words, and the optional/drop rule (or -1) that applies to them. */
    String[] replacement;
    int replacementRule = -1;
    RuleKind replacementKind;

    Entry(String[] words, RuleKind kind, int rule) {
      this.words = words;
      this.kind = kind;
      this.rule = rule;
    }
  }

  private final List<RulesFile.Rule> rules;
  private final Map<String, Entry[]> byFirstWord;
  /** The phrases that vanish: drop rules, and equate variants whose canonical form is dropped. */
  private final Map<String, Entry[]> dropsByFirstWord;

  private RuleSet(List<RulesFile.Rule> rules, Map<String, Entry[]> byFirstWord, Map<String, Entry[]> drops) {
    this.rules = List.copyOf(rules);
    this.byFirstWord = byFirstWord;
    this.dropsByFirstWord = drops;
  }

  List<RulesFile.Rule> rules() {
    return rules;
  }

  boolean isEmpty() {
    return byFirstWord.isEmpty() && dropsByFirstWord.isEmpty();
  }

  /**
   * Compiles {@code rules}, normalising each phrase with {@code normalise}. Phrases that normalise to
   * nothing are inert; a spelling claimed by two different rules, or a canonical form that another rule
   * rewrites, is an {@link InputException} at the later line.
   */
  static RuleSet compile(List<RulesFile.Rule> rules, Function<String, List<String>> normalise, Path file) {
    Map<String, Entry> phrases = new HashMap<>();
    Map<String, Integer> canonicalLines = new HashMap<>();
    List<Entry> equates = new ArrayList<>();
    for (int r = 0; r < rules.size(); r++) {
      RulesFile.Rule rule = rules.get(r);
      String[] canonical = null;
      String canonicalKey = null;
      if (rule.kind() == RuleKind.EQUATE) {
        canonical = normalise.apply(rule.canonical()).toArray(new String[0]);
        canonicalKey = String.join(" ", canonical);
        Entry asVariant = phrases.get(canonicalKey);
        if (asVariant != null && asVariant.kind == RuleKind.EQUATE)
          throw InputException.at(file, rule.line(), "canonical form '" + canonicalKey
              + "' is rewritten by the rule on line " + rules.get(asVariant.rule).line(),
              "canonical forms that no equate rule rewrites");
        canonicalLines.putIfAbsent(canonicalKey, rule.line());
      }
      for (String phrase : rule.phrases()) {
        String[] words = normalise.apply(phrase).toArray(new String[0]);
        String key = String.join(" ", words);
        if (words.length == 0 || key.equals(canonicalKey)) continue;
        Entry earlier = phrases.get(key);
        if (earlier != null) {
          boolean same = earlier.kind == rule.kind()
              && (canonical == null || Arrays.equals(earlier.replacement, canonical));
          if (same) continue;
          throw InputException.at(file, rule.line(), "'" + key + "' already has a rule on line "
              + rules.get(earlier.rule).line(), "each spelling in one rule only");
        }
        Integer canonicalLine = canonicalLines.get(key);
        if (rule.kind() == RuleKind.EQUATE && canonicalLine != null)
          throw InputException.at(file, rule.line(), "'" + key + "' is the canonical form on line "
              + canonicalLine, "canonical forms that no equate rule rewrites");
        Entry e = new Entry(words, rule.kind(), r);
        if (canonical != null) {
          e.replacement = canonical;
          equates.add(e);
        }
        phrases.put(key, e);
      }
    }
    for (Entry e : equates) {
      Entry flag = phrases.get(String.join(" ", e.replacement));
      if (flag != null && flag.kind != RuleKind.EQUATE) {
        e.replacementKind = flag.kind;
        e.replacementRule = flag.rule;
      }
    }
    List<Entry> kept = new ArrayList<>();
    List<Entry> drops = new ArrayList<>();
    for (Entry e : phrases.values()) (vanishes(e) ? drops : kept).add(e);
    return new RuleSet(rules, index(kept), index(drops));
  }

  private static boolean vanishes(Entry e) {
    return e.kind == RuleKind.DROP || e.replacementKind == RuleKind.DROP;
  }

  private static Map<String, Entry[]> index(List<Entry> entries) {
    Map<String, List<Entry>> grouped = new HashMap<>();
    for (Entry e : entries) grouped.computeIfAbsent(e.words[0], k -> new ArrayList<>()).add(e);
    Map<String, Entry[]> out = new HashMap<>();
    Comparator<Entry> longestFirst = Comparator.<Entry>comparingInt(e -> -e.words.length)
        .thenComparing(e -> String.join(" ", e.words));
    for (Map.Entry<String, List<Entry>> g : grouped.entrySet()) {
      Entry[] arr = g.getValue().toArray(new Entry[0]);
      Arrays.sort(arr, longestFirst);
      out.put(g.getKey(), arr);
    }
    return out;
  }

  /**
   * Applies the rules to {@code words}, appending the result to {@code out} with a flag per word in
   * {@code optional}, and adding the words each rule touched to {@code counts} (indexed like the rules).
   *
   * <p>Dropped phrases go first, repeatedly until none is left, so that the words on either side meet as
   * they will when the output is normalised again ({@code oh [crosstalk] kay} matches {@code oh kay}).
   * Then equate and optional phrases are matched once, greedily, longest first.
   */
  void apply(List<String> words, List<String> out, BooleanArrayList optional, LongAdder[] counts) {
    List<String> kept = dropsByFirstWord.isEmpty() ? words : withoutDropped(words, counts);
    int n = kept.size();
    int i = 0;
    while (i < n) {
      Entry e = match(byFirstWord, kept, i);
      if (e == null) {
        out.add(kept.get(i++));
        optional.add(false);
        continue;
      }
      counts[e.rule].add(e.words.length);
      i += e.words.length;
      if (e.kind == RuleKind.OPTIONAL) {
        for (String w : e.words) {
          out.add(w);
          optional.add(true);
        }
      } else {
        if (e.replacementRule >= 0) counts[e.replacementRule].add(e.replacement.length);
        boolean flag = e.replacementKind == RuleKind.OPTIONAL;
        for (String w : e.replacement) {
          out.add(w);
          optional.add(flag);
        }
      }
    }
  }

  private List<String> withoutDropped(List<String> words, LongAdder[] counts) {
    List<String> current = words;
    while (true) {
      List<String> next = null;
      int i = 0;
      int n = current.size();
      while (i < n) {
        Entry e = match(dropsByFirstWord, current, i);
        if (e == null) {
          if (next != null) next.add(current.get(i));
          i++;
          continue;
        }
        if (next == null) next = new ArrayList<>(current.subList(0, i));
        counts[e.rule].add(e.words.length);
        if (e.replacementRule >= 0) counts[e.replacementRule].add(e.replacement.length);
        i += e.words.length;
      }
      if (next == null) return current;
      current = next;
    }
  }

  private static Entry match(Map<String, Entry[]> index, List<String> words, int at) {
    Entry[] candidates = index.get(words.get(at));
    if (candidates == null) return null;
    for (Entry e : candidates) if (matchesAt(e.words, words, at)) return e;
    return null;
  }

  private static boolean matchesAt(String[] phrase, List<String> words, int at) {
    if (at + phrase.length > words.size()) return false;
    for (int k = 1; k < phrase.length; k++) if (!phrase[k].equals(words.get(at + k))) return false;
    return true;
  }
}

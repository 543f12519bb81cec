package steelyard.demo;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Simulated general-purpose speech recogniser: turns a reference sentence into a ranked N-best list.
 *
 * <p>The model of one utterance: <i>sites</i> are spans of the reference where the recogniser hesitates between
 * the true words and similar-sounding alternatives from {@link SpeechConfusions} (or between nothing and an
 * inserted filler). Each alternative gets an acoustic offset relative to the true words, drawn around a mean
 * that is more negative the less similar it sounds, with a spread that grows with the speaker's and the
 * utterance's noise, so a wrong word sometimes sounds better. At some sites the true words were pruned from the
 * search (far more often for invented grower names, which a general vocabulary lacks): every hypothesis is then
 * wrong there, which is what keeps the N-best oracle above zero. Hypotheses are combinations of choices at the
 * sites; they are scored, ranked by the first-pass total and the best {@link #MAX_HYPOTHESES} distinct texts kept.
 *
 * <p>Scores (natural log, higher is better): {@code acoustic} is the utterance's base score (roughly
 * proportional to the audio's length, so only comparable within one utterance) plus the chosen offsets and a
 * small per-hypothesis jitter; {@code lm} is {@link GenericLm}. The first-pass ranking uses
 * {@code acoustic + LM_WEIGHT·lm + WORD_BONUS·words}.
 */
final class SpeechSimulator {
  static final int MAX_HYPOTHESES = 20;
  static final double LM_WEIGHT = 9.0;
  static final double WORD_BONUS = 3.0;

  /** Log-normal spread of the per-utterance noise (background, channel): wide, so some utterances are hard. */
  private static final double UTTERANCE_NOISE = 0.8;
  /** Acoustic offset of an alternative per unit of dissimilarity, before noise. */
  private static final double GAP = 62.0;
  /** Standard deviation of an alternative's acoustic offset at noise 1. */
  private static final double SPREAD = 24.0;
  private static final double SITE_CHANCE = 0.35;
  private static final double NUMBER_SITE_CHANCE = 0.5;
  private static final double INSERT_CHANCE = 0.035;
  private static final double PRUNE_CHANCE = 0.02;
  private static final double NAME_PRUNE_CHANCE = 0.2;
  private static final double HYPOTHESIS_JITTER = 2.5;
  /** Distinct candidates gathered before ranking, and the most draws spent gathering them. */
  private static final int POOL = 60;
  private static final int DRAWS = 400;

  /** A recognised hypothesis with its scores (natural log; {@code total} is the first-pass ranking score). */
  record Candidate(String text, double acoustic, double lm, double total) {}

  /** A speaker: how clearly they speak (higher: larger acoustic gaps) and how fast (scales the base score). */
  record Speaker(String id, double clarity, double rate) {}

  private record Site(int start, int end, List<List<String>> options, double[] offsets) {}

  private final Dice dice;

  SpeechSimulator(Dice dice) {
    this.dice = dice;
  }

  /** Speakers {@code spk01…spkNN} with their own clarity and rate. */
  static Speaker[] speakers(Dice dice, int count) {
    Speaker[] speakers = new Speaker[count];
    for (int i = 0; i < count; i++) {
      double clarity = 0.65 + 0.7 * dice.uniform();
      double rate = 0.9 + 0.25 * dice.uniform();
      speakers[i] = new Speaker(String.format(Locale.ROOT, "spk%02d", i + 1), clarity, rate);
    }
    return speakers;
  }

  /** The ranked N-best list (1 to {@link #MAX_HYPOTHESES} distinct texts, best first) of one utterance. */
  List<Candidate> recognise(List<String> ref, Speaker speaker) {
    double noise = StrictMath.exp(dice.normal(0, UTTERANCE_NOISE)) / speaker.clarity();
    double base = baseAcoustic(ref, speaker);
    List<Site> sites = sites(ref, noise);
    Map<String, double[]> pool = new LinkedHashMap<>();
    int[] choice = new int[sites.size()];
    for (int s = 0; s < sites.size(); s++) choice[s] = argmax(sites.get(s).offsets());
    add(pool, ref, sites, choice);
    for (int d = 0; d < DRAWS && pool.size() < POOL; d++) {
      for (int s = 0; s < sites.size(); s++) choice[s] = sample(sites.get(s).offsets());
      add(pool, ref, sites, choice);
    }
    List<Candidate> hyps = new ArrayList<>(pool.size());
    for (Map.Entry<String, double[]> e : pool.entrySet()) {
      double acoustic = base + e.getValue()[0] + dice.normal(0, HYPOTHESIS_JITTER);
      double lm = e.getValue()[1];
      int words = e.getKey().isEmpty() ? 0 : e.getKey().split(" ").length;
      hyps.add(new Candidate(e.getKey(), acoustic, lm, acoustic + LM_WEIGHT * lm + WORD_BONUS * words));
    }
    hyps.sort((a, b) -> a.total() != b.total() ? Double.compare(b.total(), a.total()) : a.text().compareTo(b.text()));
    return List.copyOf(hyps.subList(0, Math.min(MAX_HYPOTHESES, hyps.size())));
  }

  private double baseAcoustic(List<String> ref, Speaker speaker) {
    double sum = 0;
    for (String w : ref) sum += 28 + 13 * w.length();
    return -sum * speaker.rate() + dice.normal(0, 12);
  }

  private List<Site> sites(List<String> ref, double noise) {
    List<Site> sites = new ArrayList<>();
    int i = 0;
    while (i < ref.size()) {
      if (i > 0 && dice.chance(INSERT_CHANCE * noise)) sites.add(insertion(i, noise));
      int span = 2;
      List<SpeechConfusions.Alternative> alts = i + 1 < ref.size() ? SpeechConfusions.of(ref.get(i) + " " + ref.get(i + 1)) : List.of();
      if (alts.isEmpty()) {
        span = 1;
        alts = SpeechConfusions.of(ref.get(i));
      }
      boolean name = SpeechConfusions.isGrowerName(ref.get(i));
      double chance = Math.min(0.9, (NumberWords.isNumberWord(ref.get(i)) ? NUMBER_SITE_CHANCE : SITE_CHANCE) * noise);
      if (!alts.isEmpty() && (name || dice.chance(chance))) {
        sites.add(substitution(ref.subList(i, i + span), i, alts, noise, name));
        i += span;
      } else {
        i++;
      }
    }
    return sites;
  }

  private Site substitution(List<String> words, int start, List<SpeechConfusions.Alternative> alts, double noise, boolean name) {
    List<List<String>> options = new ArrayList<>();
    List<Double> offsets = new ArrayList<>();
    boolean pruned = dice.chance(Math.min(0.9, (name ? NAME_PRUNE_CHANCE : PRUNE_CHANCE) * noise));
    if (!pruned) {
      options.add(List.copyOf(words));
      offsets.add(0.0);
    }
    for (SpeechConfusions.Alternative alt : alts) {
      if (options.size() > 0 && !dice.chance(0.75)) continue;
      options.add(alt.words());
      offsets.add(offset(alt.similarity(), noise));
    }
    if (options.isEmpty()) {
      options.add(List.copyOf(words));
      offsets.add(0.0);
    }
    return new Site(start, start + words.size(), options, unbox(offsets));
  }

  private Site insertion(int at, double noise) {
    String filler = dice.pick(SpeechConfusions.FILLERS);
    return new Site(at, at, List.of(List.of(), List.of(filler)), new double[] {0.0, offset(0.55, noise)});
  }

  /** Acoustic log-score of an alternative relative to the true words: usually negative, sometimes positive. */
  private double offset(double similarity, double noise) {
    return -GAP * (1.15 - similarity) / noise + dice.normal(0, SPREAD * StrictMath.sqrt(noise));
  }

  private void add(Map<String, double[]> pool, List<String> ref, List<Site> sites, int[] choice) {
    List<String> words = new ArrayList<>(ref.size() + 4);
    double acoustic = 0;
    int next = 0;
    for (int s = 0; s < sites.size(); s++) {
      Site site = sites.get(s);
      words.addAll(ref.subList(next, site.start()));
      words.addAll(site.options().get(choice[s]));
      acoustic += site.offsets()[choice[s]];
      next = site.end();
    }
    words.addAll(ref.subList(next, ref.size()));
    String text = String.join(" ", words);
    if (!pool.containsKey(text)) pool.put(text, new double[] {acoustic, GenericLm.logProb(words)});
  }

  private static int argmax(double[] values) {
    int best = 0;
    for (int i = 1; i < values.length; i++) if (values[i] > values[best]) best = i;
    return best;
  }

  /** Draws an option with probability proportional to exp(offset / 30): mostly near the best ones. */
  private int sample(double[] offsets) {
    double max = offsets[argmax(offsets)];
    double[] weights = new double[offsets.length];
    double sum = 0;
    for (int i = 0; i < offsets.length; i++) sum += weights[i] = StrictMath.exp((offsets[i] - max) / 30.0);
    double u = dice.uniform() * sum;
    for (int i = 0; i < weights.length; i++) if ((u -= weights[i]) < 0) return i;
    return weights.length - 1;
  }

  private static double[] unbox(List<Double> values) {
    return values.stream().mapToDouble(Double::doubleValue).toArray();
  }

  /** The words of a sentence (single spaces in generated text; empty strings skipped). */
  static String[] splitWords(String sentence) {
    return Arrays.stream(sentence.split(" ")).filter(w -> !w.isEmpty()).toArray(String[]::new);
  }
}

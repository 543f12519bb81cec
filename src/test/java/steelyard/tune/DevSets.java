package steelyard.tune;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.LanguageModel;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/** Builds small dev sets in memory: hypotheses in rank order with their feature values, one system. */
final class DevSets {
  static final Normaliser EXACT = Normaliser.create(NormalisationOptions.EXACT);
  static final Tokenizer WORDS = raw -> EXACT.tokens(raw, Unit.WORD);

  private DevSets() {}

  /** One utterance; {@code texts[i]} has rank i + 1 and features {@code features[i]}. */
  static DevUtterance utterance(String id, String reference, String[] texts, double[][] features, LanguageModel lm) {
    return utterance(id, reference, texts, features, null, lm);
  }

  /** As above, with a system name per hypothesis (null: one unnamed system); ranks count within each system. */
  static DevUtterance utterance(String id, String reference, String[] texts, double[][] features, String[] systems, LanguageModel lm) {
    List<Hypothesis> hyps = new ArrayList<>();
    Map<String, Integer> ranks = new HashMap<>();
    for (int i = 0; i < texts.length; i++) {
      String sys = systems == null ? "" : systems[i];
      int rank = ranks.merge(sys, 1, Integer::sum);
      hyps.add(new Hypothesis(id, sys, rank, texts[i], features[i], "", i, i + 2));
    }
    HypothesisScorer scorer = new HypothesisScorer(lm, WORDS, WORDS, features.length == 0 ? 0 : features[0].length, 0);
    return new DevUtterance(scorer.score(new UtteranceHypotheses(id, hyps, 0)), WORDS.tokenize(reference), "");
  }

  /** Weights: the given feature weights, everything else at its default. */
  static RescoreWeights weights(List<String> names, double... featureWeights) {
    RescoreWeights d = RescoreWeights.defaults(names);
    Map<String, Double> f = new java.util.LinkedHashMap<>();
    for (int i = 0; i < names.size(); i++) f.put(names.get(i), featureWeights[i]);
    return new RescoreWeights(f, d.lmWeight(), d.oovWeight(), d.lengthWeight(), d.posteriorScale(), d.systemWeights(),
        d.mbrMaxHypotheses(), d.latticeLmWeight(), d.latticeLengthWeight(), d.beam(), d.latticeMaxHypotheses());
  }

  private static final String[] VOCAB = {"bay", "day", "four", "for", "crates", "pears", "to", "dock"};

  /**
   * A random dev set: {@code utts} utterances, references of 2–7 words from a small vocabulary, 1–{@code maxHyps}
   * distinct-or-not random edits of it, {@code features} Gaussian features per hypothesis (the first loosely tied
   * to the hypothesis's errors, so tuning has something to find).
   */
  static List<DevUtterance> random(SplittableRandom rnd, int utts, int maxHyps, int features) {
    List<DevUtterance> out = new ArrayList<>();
    for (int u = 0; u < utts; u++) {
      List<String> ref = words(rnd, 2 + rnd.nextInt(6));
      int n = 1 + rnd.nextInt(maxHyps);
      String[] texts = new String[n];
      double[][] f = new double[n][features];
      for (int i = 0; i < n; i++) {
        List<String> h = new ArrayList<>(ref);
        int edits = rnd.nextInt(3);
        for (int e = 0; e < edits; e++) edit(rnd, h);
        texts[i] = String.join(" ", h);
        for (int c = 0; c < features; c++) f[i][c] = LinearTuner.gaussian(rnd) - (c == 0 ? edits : 0);
      }
      out.add(utterance("u" + u, String.join(" ", ref), texts, f, null));
    }
    return out;
  }

  /** A dev set and the model trained on text from the same word chain. */
  record WithModel(List<DevUtterance> dev, LanguageModel model) {}

  /**
   * References walk a fixed word chain (each word has two successors), a word 3-gram (modified Kneser-Ney) is
   * trained on 400 more walks, and hypotheses are random edits of the reference with an {@code acoustic} feature
   * loosely tied to their errors; the model then knows something the feature does not.
   */
  static WithModel withModel(SplittableRandom rnd, int utts, int maxHyps) {
    int[][] next = new int[VOCAB.length][2];
    for (int[] n : next) for (int k = 0; k < 2; k++) n[k] = rnd.nextInt(VOCAB.length);
    List<List<String>> corpus = new ArrayList<>();
    for (int i = 0; i < 400; i++) corpus.add(walk(rnd, next, 3 + rnd.nextInt(5)));
    LanguageModel lm = new steelyard.lm.train.Trainer(steelyard.lm.train.TrainingOptions.of(3, steelyard.lm.train.Smoothing.MKN))
        .train(steelyard.lm.train.SentenceSource.of(corpus)).model();
    List<DevUtterance> out = new ArrayList<>();
    for (int u = 0; u < utts; u++) {
      List<String> ref = walk(rnd, next, 3 + rnd.nextInt(5));
      int n = 2 + rnd.nextInt(maxHyps - 1);
      String[] texts = new String[n];
      double[][] f = new double[n][1];
      for (int i = 0; i < n; i++) {
        List<String> h = new ArrayList<>(ref);
        int edits = rnd.nextInt(4);
        for (int e = 0; e < edits; e++) edit(rnd, h);
        texts[i] = String.join(" ", h);
        f[i][0] = 2 * LinearTuner.gaussian(rnd) - edits;
      }
      out.add(utterance("u" + u, String.join(" ", ref), texts, f, lm));
    }
    return new WithModel(out, lm);
  }

  private static List<String> walk(SplittableRandom rnd, int[][] next, int n) {
    List<String> w = new ArrayList<>();
    int at = rnd.nextInt(VOCAB.length);
    for (int i = 0; i < n; i++) {
      w.add(VOCAB[at]);
      at = next[at][rnd.nextInt(2)];
    }
    return w;
  }

  private static List<String> words(SplittableRandom rnd, int n) {
    List<String> w = new ArrayList<>();
    for (int i = 0; i < n; i++) w.add(VOCAB[rnd.nextInt(VOCAB.length)]);
    return w;
  }

  private static void edit(SplittableRandom rnd, List<String> h) {
    int kind = rnd.nextInt(3);
    if (kind == 0 && !h.isEmpty()) h.remove(rnd.nextInt(h.size()));
    else if (kind == 1) h.add(rnd.nextInt(h.size() + 1), VOCAB[rnd.nextInt(VOCAB.length)]);
    else if (!h.isEmpty()) h.set(rnd.nextInt(h.size()), VOCAB[rnd.nextInt(VOCAB.length)]);
  }
}

package steelyard.bench;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.BackoffModel;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.text.TokenSequence;
import steelyard.tune.DevUtterance;
import steelyard.tune.TuneInput;

/**
 * A seeded dev set for the tuning benchmarks, built like {@link LatticeBenchmark}'s: a word chain over 2 000
 * words, a 3-gram counted from 300 000 tokens of it, references of 10–20 chain words and N variants each that
 * share the utterance's confusions ({@link #variants}), ranked by an {@code acoustic} feature that falls with a
 * variant's errors (plus noise), and a generic {@code lm} feature (noise and length). Tokens are interned so that
 * 1 M hypotheses fit in a few hundred MB.
 */
public final class TuneBenchData {
  public static final List<String> FEATURES = List.of("acoustic", "lm");
  private static final int VOCAB = 2000;

  private TuneBenchData() {}

  public static TuneInput make(int utterances, int perUtterance, long seed) {
    SplittableRandom rnd = new SplittableRandom(seed);
    int[][] successors = new int[VOCAB][8];
    for (int[] s : successors) for (int j = 0; j < 8; j++) s[j] = rnd.nextInt(VOCAB);
    BackoffModel lm = LatticeBenchmark.countedTrigramModel(rnd, successors, 300_000);
    Map<String, String> interned = new HashMap<>();
    Tokenizer words = raw -> {
      List<String> t = new ArrayList<>();
      for (String w : raw.split(" ")) if (!w.isEmpty()) t.add(interned.computeIfAbsent(w, x -> x));
      return new TokenSequence(t, new boolean[t.size()]);
    };
    HypothesisScorer scorer = new HypothesisScorer(lm, words, words, FEATURES.size(), 0);
    List<DevUtterance> dev = new ArrayList<>(utterances);
    for (int u = 0; u < utterances; u++) {
      List<String> ref = new ArrayList<>();
      int w = rnd.nextInt(VOCAB);
      for (int i = 10 + rnd.nextInt(11); i > 0; i--) {
        ref.add("w" + w);
        w = successors[w][rnd.nextInt(8)];
      }
      String id = "bench-" + u;
      UtteranceHypotheses hyps = variants(rnd, successors, id, ref, perUtterance);
      dev.add(new DevUtterance(scorer.score(hyps), words.tokenize(String.join(" ", ref)), "g" + (u % 10)));
    }
    return TuneInput.of(dev, FEATURES, lm, RescoreWeights.defaults(FEATURES));
  }

  /**
   * N variants sharing the utterance's confusions: a quarter of the positions are confusable, with one or two
   * alternatives each (half of them words the chain allows after the previous word, so the model cannot tell them
   * apart; half arbitrary words); one position in 20 is lost (every variant has an alternative there, so the
   * N-best oracle stays above 0). A variant takes each alternative with probability 0.4 and deletes or inserts a
   * word with probability 0.02 each.
   */
  private static UtteranceHypotheses variants(SplittableRandom rnd, int[][] successors, String id, List<String> ref, int n) {
    int len = ref.size();
    String[][] alternatives = new String[len][];
    boolean[] lost = new boolean[len];
    for (int i = 0; i < len; i++) {
      double x = rnd.nextDouble();
      if (x >= 0.25) continue;
      lost[i] = x < 0.05;
      int prev = i == 0 ? rnd.nextInt(VOCAB) : Integer.parseInt(ref.get(i - 1).substring(1));
      alternatives[i] = new String[1 + rnd.nextInt(2)];
      for (int k = 0; k < alternatives[i].length; k++)
        alternatives[i][k] = "w" + (rnd.nextBoolean() ? successors[prev][rnd.nextInt(8)] : rnd.nextInt(VOCAB));
    }
    String[] text = new String[n];
    double[][] f = new double[n][];
    Integer[] order = new Integer[n];
    for (int h = 0; h < n; h++) {
      List<String> hyp = new ArrayList<>();
      int edits = 0;
      for (int i = 0; i < len; i++) {
        if (rnd.nextDouble() < 0.02) {
          edits++;
          continue;
        }
        boolean alt = alternatives[i] != null && (lost[i] || rnd.nextDouble() < 0.4);
        String w = alt ? alternatives[i][rnd.nextInt(alternatives[i].length)] : ref.get(i);
        edits += w.equals(ref.get(i)) ? 0 : 1;
        hyp.add(w);
        if (rnd.nextDouble() < 0.02) {
          hyp.add("w" + rnd.nextInt(VOCAB));
          edits++;
        }
      }
      text[h] = String.join(" ", hyp);
      f[h] = new double[] {-40.0 * len - 1.5 * edits + 3 * gaussian(rnd), -2.3 * hyp.size() + 2 * gaussian(rnd)};
      order[h] = h;
    }
    Arrays.sort(order, (a, b) -> Double.compare(f[b][0], f[a][0]));
    List<Hypothesis> rows = new ArrayList<>(n);
    for (int r = 0; r < n; r++) rows.add(new Hypothesis(id, "", r + 1, text[order[r]], f[order[r]], "", r, r + 2));
    return new UtteranceHypotheses(id, rows, 0);
  }

  private static double gaussian(SplittableRandom rnd) {
    return Math.sqrt(-2 * Math.log(1 - rnd.nextDouble())) * Math.cos(2 * Math.PI * rnd.nextDouble());
  }
}

package steelyard.tune;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import steelyard.eval.Aligner;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.TokenSequence;

/**
 * The N-best part of tuning: the dev hypotheses as a {@link CandidateTable} whose columns are the terms of
 * {@link steelyard.rescore.LogLinear} (F features, ln P_LM, OOV count, token count, in that order, so a weighted
 * sum equals the rescorer's total), and the mapping between those columns and {@link RescoreWeights}.
 *
 * <p>Each hypothesis's errors against the reference are computed once here (S+D+I, optional tokens free, as
 * {@link steelyard.rescore.ReferenceScorer} counts them).
 */
final class NbestTuning {
  final TuneInput input;
  final CandidateTable table;
  final List<String> names;
  final int[] dims;
  final double[] low;
  final double[] high;

  NbestTuning(TuneInput input, CandidateTable table, TuneSettings settings) {
    this.input = input;
    this.table = table;
    this.names = columnNames(input.featureNames());
    List<Integer> moving = new ArrayList<>();
    low = new double[names.size()];
    high = new double[names.size()];
    for (int c = 0; c < names.size(); c++) {
      WeightRange r = settings.range(names.get(c));
      low[c] = r.low();
      high[c] = r.high();
      boolean byDefault = c > 0 || input.featureNames().isEmpty();
      if (settings.moves(names.get(c), byDefault && varies(table, c))) moving.add(c);
    }
    dims = moving.stream().mapToInt(Integer::intValue).toArray();
  }

  /** Column names: the features, then λ, ω, μ. */
  static List<String> columnNames(List<String> features) {
    List<String> n = new ArrayList<>(features);
    n.add(WeightNames.LM);
    n.add(WeightNames.OOV);
    n.add(WeightNames.LENGTH);
    return n;
  }

  /** Whether column c differs between two hypotheses of some utterance (else no weight on it changes a pick). */
  private static boolean varies(CandidateTable t, int c) {
    for (int u = 0; u < t.utterances(); u++)
      for (int h = t.start[u] + 1; h < t.start[u + 1]; h++) if (t.column[c][h] != t.column[c][t.start[u]]) return true;
    return false;
  }

  /** The weights of {@code w} as a column vector. */
  double[] vector(RescoreWeights w) {
    return vector(w, input.featureNames());
  }

  /** The N-best weights of {@code w} as a column vector over {@link #columnNames}{@code (features)}. */
  static double[] vector(RescoreWeights w, List<String> features) {
    double[] f = w.featureWeights(features);
    double[] v = new double[f.length + 3];
    System.arraycopy(f, 0, v, 0, f.length);
    v[f.length] = w.lmWeight();
    v[f.length + 1] = w.oovWeight();
    v[f.length + 2] = w.lengthWeight();
    return v;
  }

  /** {@code base} with its feature weights, λ, ω and μ taken from {@code v}. */
  RescoreWeights apply(RescoreWeights base, double[] v) {
    int f = input.featureNames().size();
    Map<String, Double> features = new LinkedHashMap<>();
    for (int i = 0; i < f; i++) features.put(input.featureNames().get(i), v[i]);
    return new RescoreWeights(features, v[f], v[f + 1], v[f + 2], base.posteriorScale(), base.systemWeights(),
        base.mbrMaxHypotheses(), base.latticeLmWeight(), base.latticeLengthWeight(), base.beam(), base.latticeMaxHypotheses(),
        base.voteConfidence());
  }

  /** Tunes the moving weights from {@code start} over {@code utts}. */
  LinearTuner.Outcome tune(RescoreWeights start, int[] utts, TuneSettings settings, SplittableRandom rnd, Workers workers) {
    return tuner(utts, settings, workers).run(vector(start), rnd);
  }

  LinearTuner tuner(int[] utts, TuneSettings settings, Workers workers) {
    return new LinearTuner(table, utts, dims, low, high, settings.effort(), workers);
  }

  /** The dev hypotheses as a candidate table; errors are computed per block with one aligner each. */
  static CandidateTable table(TuneInput input, Workers workers) {
    List<DevUtterance> utts = input.utterances();
    int u = utts.size();
    int f = input.featureNames().size();
    int[] start = new int[u + 1];
    for (int k = 0; k < u; k++) start[k + 1] = start[k] + utts.get(k).scores().size();
    int h = start[u];
    double[][] column = new double[f + 3][h];
    int[] errors = new int[h];
    int[] tie = new int[h];
    boolean[] unchanged = new boolean[h];
    int[] firstErrors = new int[u];
    int[] refTokens = new int[u];
    workers.blocks(u, (b, from, to) -> {
      Aligner aligner = new Aligner();
      for (int k = from; k < to; k++) {
        DevUtterance d = utts.get(k);
        ScoredUtterance s = d.scores();
        TokenSequence ref = d.reference();
        int[] refIds = s.idsOf(ref.tokens());
        int[][] ids = s.tokenIds();
        List<String> first = s.tokens(s.firstIndex()).tokens();
        for (int i = 0; i < s.size(); i++) {
          int x = start[k] + i;
          for (int c = 0; c < f; c++) column[c][x] = s.feature(i, c);
          column[f][x] = s.lmLogProb(i);
          column[f + 1][x] = s.oovCount(i);
          column[f + 2][x] = s.tokenCount(i);
          errors[x] = (int) aligner.count(refIds, ref.optional(), ids[i], s.tokens(i).optional()).errors();
          tie[x] = s.tieOrder(i);
          unchanged[x] = s.tokens(i).tokens().equals(first);
        }
        firstErrors[k] = errors[start[k] + s.firstIndex()];
        refTokens[k] = d.referenceTokens();
      }
    });
    return new CandidateTable(start, column, errors, tie, unchanged, firstErrors, refTokens);
  }
}

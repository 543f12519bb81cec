package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/** Sweeps and surfaces against brute force: the rescorer's own choice at every point. */
class WeightSweepTest {
  static final List<String> ACOUSTIC = List.of("acoustic");

  private static TuneInput input(long seed) {
    DevSets.WithModel d = DevSets.withModel(new SplittableRandom(seed), 40, 8);
    return TuneInput.of(d.dev(), ACOUSTIC, d.model(), DevSets.weights(ACOUSTIC, 1));
  }

  private static RescoreWeights at(TuneInput in, double lm, double length, double scale, double latticeLm, double latticeLength) {
    RescoreWeights s = in.start();
    RescoreWeights n = new RescoreWeights(s.features(), lm, s.oovWeight(), length, scale, s.systemWeights(), s.mbrMaxHypotheses(),
        latticeLm, latticeLength, s.beam(), s.latticeMaxHypotheses());
    return n;
  }

  /** Brute force: every grid cell re-chosen by the rescorer and scored. */
  @Test
  void nbestSurfaceEqualsTheRescorersChoiceAtEveryGridPoint() {
    TuneInput in = input(21);
    double[] lm = WeightSweep.linear(0, 6, 13);
    double[] len = WeightSweep.linear(-4, 4, 9);
    ErrorSurface s = WeightSweep.of(in, 2).nbestSurface(in.start(), WeightNames.LENGTH, len, WeightNames.LM, lm);
    for (int r = 0; r < len.length; r++)
      for (int c = 0; c < lm.length; c++)
        assertThat(s.errors()[r][c]).as("μ=%s λ=%s", len[r], lm[c])
            .isEqualTo(DevErrors.score(in, at(in, lm[c], len[r], 1, 0, 0), RescoreMethod.NBEST, 1).errors());
  }

  @Test
  void nbestSweepCountsAgreeWithTheRescorerInsideEveryInterval() {
    TuneInput in = input(22);
    Sweep s = WeightSweep.of(in, 1).nbest(in.start(), WeightNames.LM, 0, 8);
    for (int j = 0; j < s.intervals(); j++) {
      double mid = (s.intervalLow(j) + s.intervalHigh(j)) / 2;
      assertThat(s.errors()[j]).isEqualTo(DevErrors.score(in, at(in, mid, 0, 1, 0, 0), RescoreMethod.NBEST, 1).errors());
    }
    assertThat(s.exact()).isTrue();
  }

  /** At the λ′ values the pools were searched at, the pooled paths hold the search's own best path. */
  @Test
  void latticeSweepEqualsTheRescorersChoiceAtTheSearchedPoints() {
    TuneInput in = input(23);
    RescoreWeights w = at(in, 1, 0, 0.3, 0.5, 0.5);
    Sweep s = WeightSweep.of(in, 2).lattice(w, 0, 3, 5, 4);
    assertThat(s.exact()).isFalse();
    for (double l : WeightSweep.linear(0, 3, 4)) {
      if (l == 0 || l == 3) continue; // the ends of the range are not inside an interval
      long truth = DevErrors.score(in, at(in, 1, 0, 0.3, l, 0.5), RescoreMethod.LATTICE, 1).errors();
      assertThat(s.errorsAt(l)).as("λ′ = %s", l).isEqualTo(truth);
    }
    assertThat(s.errorsAt(0.5)).isEqualTo(DevErrors.score(in, w, RescoreMethod.LATTICE, 1).errors());
  }

  @Test
  void foldsPutEveryUtteranceInExactlyOneHeldOutFoldOfNearlyEqualSize() {
    Folds f = new Folds(23, 5, 7);
    int[] seen = new int[23];
    for (int k = 0; k < 5; k++) {
      assertThat(f.test(k).length).isBetween(4, 5);
      assertThat(f.train(k).length + f.test(k).length).isEqualTo(23);
      for (int u : f.test(k)) seen[u]++;
    }
    assertThat(seen).containsOnly(1);
    assertThat(new Folds(23, 5, 7).test(2)).containsExactly(f.test(2));
  }
}

package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/** The tuning service on seeded random dev sets: invariants that must hold whatever the data. */
class TunerTest {
  static final List<String> ACOUSTIC = List.of("acoustic");

  private static TuneInput input(long seed, int utts) {
    DevSets.WithModel d = DevSets.withModel(new SplittableRandom(seed), utts, 8);
    return TuneInput.of(d.dev(), ACOUSTIC, d.model(), DevSets.weights(ACOUSTIC, 1));
  }

  /** Fewer restarts, passes and pool rounds than the defaults: the invariants hold for any effort. */
  private static TuneSettings.Builder fast() {
    return TuneSettings.builder().folds(3).search(2, 2, 20).pools(5, 4);
  }

  /** Invariant: tuned weights are kept only when they beat the start on the dev set (never worse). */
  @ParameterizedTest(name = "seed {0}")
  @ValueSource(longs = {1, 2, 3, 4, 5, 6, 7, 8})
  void tunedWeightsNeverMakeDevErrorWorseThanTheStart(long seed) {
    TuneInput in = input(seed, 40);
    TuneResult r = Tuner.tune(in, fast().build(), TuneProgress.NONE, () -> false);
    for (MethodFigures f : r.perMethod()) {
      long start = DevErrors.score(in, in.start(), f.method(), 1).errors();
      assertThat(f.devErrors()).as("seed %d %s", seed, f.method()).isLessThanOrEqualTo(start);
      assertThat(f.startErrors()).isEqualTo(start);
      assertThat(DevErrors.score(in, f.weights(), f.method(), 1).errors()).as("reported = recomputed").isEqualTo(f.devErrors());
    }
  }

  @Test
  void nbestTuningFromABadStartFindsFewerErrorsAndReportsExactIntervalsAroundTheTunedWeights() {
    TuneInput in = input(11, 60);
    TuneResult r = Tuner.tune(in, fast().methods(Set.of(RescoreMethod.NBEST)).build(), TuneProgress.NONE, () -> false);
    MethodFigures f = r.figures(RescoreMethod.NBEST);
    assertThat(f.devErrors()).isLessThan(f.startErrors());
    assertThat(f.bestInterval()).containsOnlyKeys(WeightNames.LM, WeightNames.LENGTH);
    WeightInterval lm = f.bestInterval().get(WeightNames.LM);
    assertThat(lm.exact()).isTrue();
    assertThat(lm.low()).isLessThan(lm.chosen());
    assertThat(lm.chosen()).isLessThan(lm.high()).isEqualTo(f.weights().lmWeight());
    assertThat(f.weights().lmWeight()).isGreaterThanOrEqualTo(0);
  }

  @Test
  void resultsAreIdenticalForAnyThreadCount() {
    TuneInput in = input(5, 300);
    TuneResult one = Tuner.tune(in, fast().build(), TuneProgress.NONE, () -> false);
    TuneResult three = Tuner.tune(in, fast().threads(3).build(), TuneProgress.NONE, () -> false);
    assertThat(three.weights()).isEqualTo(one.weights());
    assertThat(three.method()).isEqualTo(one.method());
    for (RescoreMethod m : RescoreMethod.values()) {
      assertThat(three.figures(m).devErrors()).isEqualTo(one.figures(m).devErrors());
      assertThat(three.figures(m).cvErrors()).isEqualTo(one.figures(m).cvErrors());
      assertThat(three.figures(m).weights()).isEqualTo(one.figures(m).weights());
    }
  }

  /** The network search on a sample of the utterances, then λ′ and μ′ again on all of them. */
  @Test
  void latticeTuningOnASampleIsNeverWorseThanTheStartAndTheSameForAnyThreadCount() {
    TuneInput in = input(12, 90);
    TuneSettings s = fast().methods(Set.of(RescoreMethod.LATTICE)).outerSample(30).build();
    TuneResult one = Tuner.tune(in, s, TuneProgress.NONE, () -> false);
    TuneResult two = Tuner.tune(in, s.toBuilder().threads(2).build(), TuneProgress.NONE, () -> false);
    MethodFigures f = one.figures(RescoreMethod.LATTICE);
    assertThat(f.devErrors()).isLessThanOrEqualTo(DevErrors.score(in, in.start(), RescoreMethod.LATTICE, 1).errors());
    assertThat(DevErrors.score(in, f.weights(), RescoreMethod.LATTICE, 1).errors()).isEqualTo(f.devErrors());
    assertThat(two.weights()).isEqualTo(one.weights());
    assertThat(two.cvErrorRate()).isEqualTo(one.cvErrorRate());
  }

  @Test
  void onlyTheListedWeightsMove() {
    TuneInput in = input(3, 40);
    TuneResult r = Tuner.tune(in, fast().methods(EnumSet.of(RescoreMethod.NBEST, RescoreMethod.CONSENSUS))
        .tune(Set.of(WeightNames.LENGTH)).build(), TuneProgress.NONE, () -> false);
    for (MethodFigures f : r.perMethod()) {
      RescoreWeights w = f.weights();
      assertThat(w.lmWeight()).isEqualTo(in.start().lmWeight());
      assertThat(w.features()).isEqualTo(in.start().features());
      assertThat(w.posteriorScale()).isEqualTo(in.start().posteriorScale());
    }
  }

  @Test
  void crossValidationReportsHeldOutErrorsOfEveryMethod() {
    TuneResult r = Tuner.tune(input(4, 50), fast().build(), TuneProgress.NONE, () -> false);
    assertThat(r.folds()).isEqualTo(3);
    assertThat(r.perMethod()).hasSize(4);
    for (MethodFigures f : r.perMethod()) assertThat(f.cvErrors()).isNotNegative();
    assertThat(r.cvErrorRate()).isEqualTo(r.figures(r.method()).cvErrorRate());
  }

  @Test
  void theKeptMethodHasTheFewestCrossValidatedErrors() {
    TuneResult r = Tuner.tune(input(6, 50), fast().build(), TuneProgress.NONE, () -> false);
    for (MethodFigures f : r.perMethod()) assertThat(r.figures(r.method()).cvErrors()).isLessThanOrEqualTo(f.cvErrors());
  }

  @Test
  void withoutFoldsTheResultSaysSo() {
    TuneResult r = Tuner.tune(input(7, 20), fast().folds(0).methods(Set.of(RescoreMethod.NBEST)).build(), TuneProgress.NONE, () -> false);
    assertThat(r.cvErrorRate()).isNaN();
    assertThat(r.warnings()).anyMatch(w -> w.contains("cross-validation is off"));
  }

  @Test
  void progressNeverGoesBackAndEndsAtOne() {
    List<Double> seen = new ArrayList<>();
    Tuner.tune(input(8, 30), fast().build(), (f, m) -> seen.add(f), () -> false);
    assertThat(seen).isSorted().last().isEqualTo(1.0);
  }

  @Test
  void cancellingStopsTheRun() {
    AtomicInteger polls = new AtomicInteger();
    assertThatThrownBy(() -> Tuner.tune(input(9, 40), fast().build(), TuneProgress.NONE, () -> polls.incrementAndGet() > 5))
        .isInstanceOf(CancellationException.class);
  }

  @Test
  void anUnknownWeightNameIsAUserError() {
    assertThatThrownBy(() -> Tuner.tune(input(10, 10), fast().tune(Set.of("lm-weight")).build(), TuneProgress.NONE, () -> false))
        .isInstanceOf(InputException.class).hasMessageContaining("lm-weight").hasMessageContaining(WeightNames.LM);
  }
}

package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.EnumSet;
import org.junit.jupiter.api.Test;
import steelyard.io.FeatureSpec;
import steelyard.lm.ModelFiles;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.ScoredSet;

/**
 * Tuning wired onto the rescoring service, on the bundled voice dev set and model: the errors the tuner reports
 * for its weights are the errors a streaming {@code rescore} run with those weights counts (another route
 * through the service, not the tuner's own arithmetic).
 */
class SessionTuneTest {
  static final Path HYPS = Path.of("sample-hypotheses/voice-dev.nbest.csv");
  static final Path REFS = Path.of("sample-hypotheses/voice-dev.refs.csv");

  @Test
  void reportedDevErrorsAreWhatAStreamingRescoreRunCountsWithTheTunedWeights() {
    RescoreSession session = RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic,lm"))
        .model(ModelFiles.load(Path.of("models/voice-3gram.arpa.gz"))).build());
    ScoredSet set = session.loadAll(HYPS, REFS, 2, RescoreSession.LoadListener.NONE, () -> false);
    TuneInput in = TuneInput.of(set, session, session.weights());
    TuneSettings s = TuneSettings.builder().methods(EnumSet.of(RescoreMethod.NBEST, RescoreMethod.LATTICE)).folds(3)
        .search(2, 2, 20).pools(5, 4).threads(2).build();
    TuneResult r = Tuner.tune(in, s, TuneProgress.NONE, () -> false);
    assertThat(r.utterances()).isEqualTo(300);
    for (MethodFigures f : r.perMethod()) {
      RescoreSession tuned = session.withWeights(f.weights(), f.method());
      RescoreSummary summary = tuned.run(HYPS, tuned.readReferences(REFS), 2, o -> { });
      assertThat(summary.chosen().errors()).as(f.method().label()).isEqualTo(f.devErrors());
      assertThat(summary.chosen().referenceTokens()).isEqualTo(r.referenceTokens());
      assertThat(f.devErrors()).isLessThan(f.startErrors());
    }
    assertThat(r.devFirstErrorRate()).isGreaterThan(r.devErrorRate());
  }
}

package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.eval.EditCounts;
import steelyard.io.FeatureSpec;
import steelyard.io.InputException;
import steelyard.io.Reference;
import steelyard.lattice.Lattices;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.text.TokenSequence;

/**
 * The rescoring service against itself by other routes (invariants, no invented check values): streaming and
 * in-memory runs agree, any thread count gives the same outcomes, a derived session equals a freshly opened
 * one, and the network kept with a result gives the same lattice oracle as one built afresh. Inputs are the
 * bundled demo dev sets and model.
 */
class RescoreSessionTest {
  static final Path HYPS = Path.of("sample-hypotheses/voice-dev.nbest.csv");
  static final Path REFS = Path.of("sample-hypotheses/voice-dev.refs.csv");
  static LanguageModel lm;

  @BeforeAll
  static void loadModel() {
    lm = ModelFiles.load(Path.of("models/voice-3gram.arpa.gz"));
  }

  static RescoreConfig.Builder voice(RescoreMethod method) {
    WeightsSpec w = new WeightsSpec();
    w.lmWeight = 12.0;
    w.lengthWeight = 4.0;
    w.posteriorScale = 0.05;
    w.latticeLmWeight = 1.0;
    return RescoreConfig.builder().features(FeatureSpec.parseList("acoustic,lm")).model(lm).overrides(w).method(method);
  }

  /** What a run chose per utterance: id, chosen tokens and the error counts, in input order. */
  static List<String> picks(RescoreSession s, int threads, RescoreSummary[] summary) {
    List<String> out = new ArrayList<>();
    summary[0] = s.run(HYPS, s.readReferences(REFS), threads,
        o -> out.add(o.uttId() + " " + o.result().chosenTokens() + " " + o.errors()));
    return out;
  }

  @Test
  void aStreamingRunGivesTheSameOutcomesForAnyThreadCount() {
    for (RescoreMethod m : RescoreMethod.values()) {
      RescoreSession s = RescoreSession.open(voice(m).build());
      RescoreSummary[] one = new RescoreSummary[1];
      RescoreSummary[] three = new RescoreSummary[1];
      assertThat(picks(s, 3, three)).as(m.label()).isEqualTo(picks(s, 1, one)).hasSize(300);
      assertThat(three[0].chosen()).as(m.label()).isEqualTo(one[0].chosen());
    }
  }

  @Test
  void choosingOverALoadedSetCountsTheSameErrorsAsTheStreamingRun() {
    RescoreSession s = RescoreSession.open(voice(RescoreMethod.MBR).build());
    RescoreSummary[] streamed = new RescoreSummary[1];
    picks(s, 2, streamed);
    ScoredSet set = s.loadAll(HYPS, REFS, 2, RescoreSession.LoadListener.NONE, () -> false);
    EditCounts sum = EditCounts.ZERO;
    for (ScoredSet.Entry e : set.utterances()) sum = sum.plus(s.errors(s.choose(e.scores()), e.reference()).chosen());
    for (ScoredSet.Missing m : set.missingHypotheses()) sum = sum.plus(m.errors());
    assertThat(sum).isEqualTo(streamed[0].chosen());
    assertThat(set.size()).isEqualTo(300);
  }

  @Test
  void aDerivedSessionSharesTheModelAndChoosesAsAFreshlyOpenedOne() {
    RescoreSession base = RescoreSession.open(voice(RescoreMethod.NBEST).build());
    WeightsSpec other = new WeightsSpec();
    other.lmWeight = 3.0;
    other.lengthWeight = -1.0;
    other.posteriorScale = 0.2;
    other.latticeLmWeight = 0.5;
    RescoreSession fresh = RescoreSession.open(voice(RescoreMethod.LATTICE).overrides(other).build());
    RescoreSession derived = base.withWeights(fresh.weights(), RescoreMethod.LATTICE);
    assertThat(derived.model()).isSameAs(base.model());
    ScoredSet set = base.loadAll(HYPS, null, 1, RescoreSession.LoadListener.NONE, () -> false);
    for (ScoredSet.Entry e : set.utterances().subList(0, 60)) {
      assertThat(derived.choose(e.scores()).chosenTokens()).as(e.uttId()).isEqualTo(fresh.choose(e.scores()).chosenTokens());
    }
  }

  @Test
  void theLatticeOracleOfTheKeptNetworkEqualsOneBuiltAfresh() {
    RescoreSession s = RescoreSession.open(voice(RescoreMethod.LATTICE).build());
    Map<String, Reference> refs = s.readReferences(REFS);
    AtomicInteger checked = new AtomicInteger();
    s.run(HYPS, refs, 1, o -> {
      UtteranceResult r = o.result();
      assertThat(r.network()).isNotNull();
      List<String> ref = s.tokens(refs.get(o.uttId()).text()).tokens();
      int rebuilt = Lattices.oracleErrors(NbestRescorer.tokenLists(r.scores()), r.posteriors(), ref, s.weights().latticeSettings());
      assertThat(o.errors().latticeOracle()).as(o.uttId()).isEqualTo(rebuilt);
      checked.incrementAndGet();
    });
    assertThat(checked).hasValue(300);
  }

  @Test
  void nBestResultsCarryNoNetwork() {
    RescoreSession s = RescoreSession.open(voice(RescoreMethod.NBEST).build());
    ScoredSet set = s.loadAll(HYPS, null, 1, RescoreSession.LoadListener.NONE, () -> false);
    assertThat(s.choose(set.utterances().get(0).scores()).network()).isNull();
  }

  @Nested
  class Bookkeeping {
    @TempDir Path dir;

    Path write(String name, String text) throws Exception {
      return Files.writeString(dir.resolve(name), text);
    }

    @Test
    void missingReferencesAndMissingHypothesesAreListedInBothRuns() throws Exception {
      Path hyps = write("h.csv", "utt_id,text,acoustic\na,ten crates,-1\na,ten crate,-2\nb,bay nine,-1\n");
      Path refs = write("r.csv", "utt_id,text,group\na,ten crates,spk1\nc,load the leeks now,spk2\n");
      RescoreSession s = RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).build());
      RescoreSummary summary = s.run(hyps, s.readReferences(refs), 1, o -> { });
      assertThat(summary.utterances()).isEqualTo(2);
      assertThat(summary.scored()).isEqualTo(2);
      // c has no hypotheses: all four reference words deleted (the definition used by score and rescore)
      assertThat(summary.chosen()).isEqualTo(new EditCounts(2, 0, 4, 0));
      ScoredSet set = s.loadAll(hyps, refs, 1, RescoreSession.LoadListener.NONE, () -> false);
      assertThat(set.missingReferences()).containsExactly("b");
      assertThat(set.missingHypotheses()).extracting(ScoredSet.Missing::uttId).containsExactly("c");
      assertThat(set.missingHypotheses().get(0).errors().deletions()).isEqualTo(4);
      assertThat(set.utterances().get(0).group()).isEqualTo("spk1");
      assertThat(set.utterances().get(1).reference()).isNull();
    }

    @Test
    void loadingReportsProgressAndStopsWhenCancelled() throws Exception {
      StringBuilder h = new StringBuilder("utt_id,text,acoustic\n");
      for (int u = 0; u < 600; u++) h.append("u").append(u).append(",crates,-1\n");
      Path hyps = write("many.csv", h.toString());
      RescoreSession s = RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).build());
      AtomicLong last = new AtomicLong();
      assertThat(s.loadAll(hyps, null, 2, (utts, n) -> last.set(utts), () -> false).size()).isEqualTo(600);
      assertThat(last).hasValue(600);
      AtomicLong seen = new AtomicLong();
      assertThatThrownBy(() -> s.loadAll(hyps, null, 2, (utts, n) -> seen.set(utts), () -> seen.get() >= 10))
          .isInstanceOf(CancellationException.class);
      assertThat(seen.get()).isEqualTo(10);
    }
  }

  @Nested
  class WeightLayers {
    @TempDir Path dir;

    @Test
    void theCommandLineLayerOverridesTheFileAndFeaturesComeFromTheFileWhenNoneAreGiven() throws Exception {
      WeightsSpec file = new WeightsSpec();
      file.features.put("acoustic", 0.5);
      file.lmWeight = 5.0;
      file.lengthWeight = 2.0;
      Path weights = dir.resolve("w.json");
      WeightsFile.save(weights, file);
      WeightsSpec top = new WeightsSpec();
      top.lmWeight = 7.0;
      RescoreSession s = RescoreSession.open(RescoreConfig.builder().weightsFile(weights).overrides(top).model(lm).build());
      assertThat(s.featureNames()).containsExactly("acoustic");
      assertThat(s.weights().lmWeight()).isEqualTo(7.0);
      assertThat(s.weights().lengthWeight()).isEqualTo(2.0);
      assertThat(s.weights().features()).containsEntry("acoustic", 0.5);
    }

    @Test
    void aWeightForAColumnThatIsNotAFeatureIsAUserError() {
      WeightsSpec top = new WeightsSpec();
      top.features.put("confidence", 2.0);
      assertThatThrownBy(() -> RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).overrides(top).build()))
          .isInstanceOf(InputException.class).hasMessageContaining("--weight").hasMessageContaining("confidence");
    }

    @Test
    void anLmWeightWithoutAModelIsAUserErrorWhenOpeningAndAProgrammingErrorWhenDeriving() {
      WeightsSpec top = new WeightsSpec();
      top.lmWeight = 1.0;
      assertThatThrownBy(() -> RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).overrides(top).build()))
          .isInstanceOf(InputException.class).hasMessageContaining("--lm");
      RescoreSession plain = RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).build());
      RescoreWeights needsModel = plain.config().overrides().overlay(top).resolve(plain.featureNames());
      assertThatThrownBy(() -> plain.withWeights(needsModel, RescoreMethod.NBEST)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void aModelInAnotherUnitIsAWarningNotAnError() {
      RescoreSession s = RescoreSession.open(voice(RescoreMethod.NBEST).unit(steelyard.text.Unit.CHAR).build());
      assertThat(s.warnings()).anySatisfy(w -> assertThat(w).contains("the model's unit is word, the scoring unit char"));
      assertThat(s.tokens("ab c")).extracting(TokenSequence::size).isEqualTo(4);
    }
  }
}

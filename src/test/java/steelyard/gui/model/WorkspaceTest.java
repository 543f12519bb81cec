package steelyard.gui.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.cli.Main;
import steelyard.io.FeatureSpec;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.UtteranceResult;
import steelyard.text.NormalisationOptions;

/**
 * The window's figures against the command line: the same files and weights through {@code steelyard rescore
 * --json} (a separate path through the core) must give the same error rates and counts.
 */
class WorkspaceTest {
  @TempDir Path dir;
  private Path hyps;
  private Path refs;
  private Path lm;

  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    refs = dir.resolve("refs.csv");
    lm = dir.resolve("tiny.arpa");
    GuiFixtures.writeRandomSet(hyps, refs, 20261202L, 60);
    GuiFixtures.writeTinyModel(refs, lm);
  }

  private Workspace open() {
    return Workspace.open(OpenRequest.of(hyps, refs, lm, null, FeatureSpec.parseList("acoustic,lm"), null,
        NormalisationOptions.EXACT, RescoreMethod.NBEST), TaskProgress.NONE);
  }

  private static RescoreWeights weights(Workspace w, double lambda, double mu, double alpha, double lambda2, double mu2) {
    RescoreWeights b = w.initialWeights();
    return new RescoreWeights(b.features(), lambda, b.oovWeight(), mu, alpha, b.systemWeights(), b.mbrMaxHypotheses(), lambda2,
        mu2, b.beam(), b.latticeMaxHypotheses(), b.voteConfidence());
  }

  private JsonNode cli(String method, double lambda, double mu, double alpha, double lambda2, double mu2) throws IOException {
    Path json = dir.resolve("summary-" + method + ".json");
    int code = Main.run("rescore", "--hyps", hyps.toString(), "--refs", refs.toString(), "--lm", lm.toString(),
        "--features", "acoustic,lm", "--method", method, "--lm-weight", Double.toString(lambda),
        "--length-weight", Double.toString(mu), "--posterior-sharpness", Double.toString(alpha),
        "--lattice-lm-weight", Double.toString(lambda2), "--lattice-length-weight", Double.toString(mu2),
        "--json", json.toString(), "--threads", "1");
    assertThat(code).isZero();
    return new ObjectMapper().readTree(json.toFile());
  }

  private static BigDecimal sixDigits(double v) {
    return new BigDecimal(v).setScale(6, RoundingMode.HALF_EVEN);
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @ValueSource(strings = {"nbest", "mbr", "consensus", "lattice"})
  void figuresEqualThoseOfTheRescoreCommand(String method) throws IOException {
    Workspace w = open();
    Choices c = w.choose(weights(w, 2.5, 0.7, 0.3, 0.8, 0.4), RescoreMethod.valueOf(method.toUpperCase()), TaskProgress.NONE);
    JsonNode j = cli(method, 2.5, 0.7, 0.3, 0.8, 0.4);
    CorpusFigures f = c.figures();
    assertThat(sixDigits(f.errorRate())).isEqualByComparingTo(j.get("error_rate").decimalValue());
    assertThat(sixDigits(f.firstErrorRate())).isEqualByComparingTo(j.get("first_error_rate").decimalValue());
    assertThat(sixDigits(f.oracleErrorRate())).isEqualByComparingTo(j.get("oracle_error_rate").decimalValue());
    assertThat(f.changed()).isEqualTo(j.get("changed").asInt());
    assertThat(f.newTranscripts()).isEqualTo(j.get("new_transcripts").asInt());
    assertThat(f.scored()).isEqualTo(j.get("utterances").asInt());
    assertThat(f.referenceTokens()).isEqualTo(j.get("reference_tokens").asLong());
  }

  @Test
  void rerankPicksWhatTheCoreRescorerPicksAtRandomWeights() {
    Workspace w = open();
    long seed = 7L;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int trial = 0; trial < 20; trial++) {
      RescoreWeights rw = weights(w, rnd.nextDouble(-2, 10), rnd.nextDouble(-5, 5), 1, 0, 0);
      Choices c = w.rerank(rw);
      for (int u = 0; u < w.corpus().size(); u++) {
        UtteranceResult r = w.explain(u, rw, RescoreMethod.NBEST);
        assertThat(c.chosen()[u]).as("seed %d trial %d utterance %d", seed, trial, u).isEqualTo(r.chosen());
        assertThat(c.changed()[u]).isEqualTo(r.changed());
      }
    }
  }

  @Test
  void helpedAndHurtCountTheUtterancesWhoseChoiceBeatsOrLosesToRankOne() {
    Workspace w = open();
    Choices c = w.rerank(weights(w, 4, 1, 1, 0, 0));
    int helped = 0;
    int hurt = 0;
    for (int u = 0; u < w.corpus().size(); u++) {
      Choices.Verdict v = c.verdict(w.corpus(), u);
      if (v == Choices.Verdict.HELPED) helped++;
      if (v == Choices.Verdict.HURT) hurt++;
    }
    assertThat(c.figures().helped()).isEqualTo(helped);
    assertThat(c.figures().hurt()).isEqualTo(hurt);
    // identity: net change of the errors equals the summed per-utterance differences
    long net = 0;
    for (int u = 0; u < w.corpus().size(); u++) if (w.corpus().hasReference(u)) net += w.corpus().firstErrors(u) - c.errors()[u];
    assertThat(c.figures().firstErrors() - c.figures().errors()).isEqualTo(net);
  }

  @Test
  void aBadRowFailsWithTheCommandLinesMessage() throws IOException {
    Files.writeString(hyps, "utt_id,rank,text,acoustic,lm\nu1,1,ten crates,-3,-5\nu1,x,ten,-4,-5\n");
    assertThatThrownBy(this::open).isInstanceOf(InputException.class)
        .hasMessage(hyps + ":3: rank 'x' is not a whole number; expected an integer rank ≥ 1");
  }

  @Test
  void aCancelledLoadStops() {
    TaskProgress cancelled = new TaskProgress() {
      @Override public void report(double fraction, String note) {}
      @Override public boolean isCancelled() { return true; }
    };
    assertThatThrownBy(() -> Workspace.open(OpenRequest.of(hyps, refs, lm, null, FeatureSpec.parseList("acoustic"), null,
        NormalisationOptions.EXACT, null), cancelled)).isInstanceOf(CancellationException.class);
  }

  @Test
  void featuresComeFromTheWeightsFileWhenNoneAreGiven() throws IOException {
    Path wf = dir.resolve("w.json");
    open().saveWeights(wf, weights(open(), 3, 1, 1, 0, 0));
    Workspace w = Workspace.open(OpenRequest.of(hyps, refs, lm, wf, List.of(), null, NormalisationOptions.EXACT, null),
        TaskProgress.NONE);
    assertThat(w.corpus().featureNames()).containsExactly("acoustic", "lm");
    assertThat(w.initialWeights().lmWeight()).isEqualTo(3.0);
  }
}

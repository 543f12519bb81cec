package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.io.FeatureSpec;
import steelyard.io.InputException;

/**
 * The run-level refusals of {@link RescoreRun}, called as a library (no output set open): a wrong answer is
 * refused before any output is complete, so no picks, breakdown or summary file appears; a small overlap is a
 * warning in the JSON. The overlap rule is {@link steelyard.eval.UtteranceOverlap}'s (tested there).
 */
class RescoreRunRefusalTest {
  @TempDir Path dir;

  private Path write(String name, String text) throws Exception {
    return Files.writeString(dir.resolve(name), text);
  }

  private RescoreRun.Outputs outputs() {
    return new RescoreRun.Outputs(dir.resolve("picks.csv"), dir.resolve("breakdown.csv"), dir.resolve("summary.json"), null);
  }

  private static RescoreSession session(WeightsSpec overrides) {
    return RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic")).overrides(overrides).build());
  }

  private List<String> outputFiles() throws Exception {
    List<String> names = new ArrayList<>();
    try (var s = Files.list(dir)) {
      s.forEach(p -> names.add(p.getFileName().toString()));
    }
    return names;
  }

  @Test
  void referencesSharingNoUtteranceIdAreRefusedAndNoOutputAppears() throws Exception {
    Path hyps = write("h.csv", "utt_id,text,acoustic\na,ten crates,-1\nb,bay nine,-1\n");
    Path refs = write("r.csv", "utt_id,text\nx,ten crates\ny,bay nine\n");
    assertThatThrownBy(() -> RescoreRun.run(session(new WeightsSpec()), hyps, refs, outputs(), 1, 1L, List.of(), new StringWriter()))
        .isInstanceOf(InputException.class).hasMessageContaining("shares no utterance id with " + hyps);
    assertThat(outputFiles()).containsExactlyInAnyOrder("h.csv", "r.csv");
  }

  @Test
  void aSystemWeightForASystemTheFileLacksIsRefusedNamingThosePresent() throws Exception {
    Path hyps = write("h.csv", "utt_id,system,text,acoustic\na,gray,ten crates,-1\na,deskew,ten crate,-2\n");
    WeightsSpec w = new WeightsSpec();
    w.systemWeights.put("upscale", 2.0);
    assertThatThrownBy(() -> RescoreRun.run(session(w), hyps, null, outputs(), 1, 1L, List.of(), new StringWriter()))
        .isInstanceOf(InputException.class).hasMessageContaining("system 'upscale' does not occur").hasMessageContaining("deskew, gray");
    assertThat(outputFiles()).containsExactly("h.csv");
  }

  @Test
  void aSmallOverlapIsAWarningInTheJsonAfterTheCallersOwn() throws Exception {
    Path hyps = write("h.csv", "utt_id,text,acoustic\na,ten crates,-1\nb,bay nine,-1\nc,load leeks,-1\n");
    Path refs = write("r.csv", "utt_id,text\na,ten crates\ny,bay nine\nz,load leeks\n");
    RescoreRun.Result r = RescoreRun.run(session(new WeightsSpec()), hyps, refs, outputs(), 1, 1L, List.of(), new StringWriter(),
        List.of("a warning of the caller"));
    assertThat(r.warnings()).hasSize(2);
    assertThat(r.warnings().get(0)).isEqualTo("a warning of the caller");
    assertThat(r.warnings().get(1)).contains("few utterances in common: 1 of 3 references (33 %)");
    assertThat(r.json().get("warnings")).hasSize(2);
    assertThat(r.runWarnings()).containsExactly(r.warnings().get(1));
  }

  @Test
  void aSessionUsesItsModelOnlyWhenAnLmWeightIsNotZero() {
    RescoreConfig withModel = RescoreConfig.builder().features(FeatureSpec.parseList("acoustic"))
        .modelPath(Path.of("src/test/resources/bad/valid/small.arpa")).build();
    RescoreSession unweighted = RescoreSession.open(withModel);
    assertThat(unweighted.model()).isNotNull();
    assertThat(unweighted.usesModel()).as("every LM weight 0 (the defaults)").isFalse();
    WeightsSpec lm = new WeightsSpec();
    lm.lmWeight = 0.5;
    RescoreWeights weighted = new WeightsSpec().overlay(lm).resolve(unweighted.featureNames());
    assertThat(unweighted.withWeights(weighted, RescoreMethod.NBEST).usesModel()).isTrue();
    WeightsSpec lattice = new WeightsSpec();
    lattice.latticeLmWeight = 0.5;
    RescoreWeights searched = new WeightsSpec().overlay(lattice).resolve(unweighted.featureNames());
    assertThat(unweighted.withWeights(searched, RescoreMethod.CONSENSUS).usesModel()).as("λ′ counts only in the lattice search").isFalse();
    assertThat(unweighted.withWeights(searched, RescoreMethod.LATTICE).usesModel()).isTrue();
  }
}

package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import java.util.stream.Stream;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.io.InputException;
import steelyard.text.Unit;

/** Weights-file schema; line and column positions counted by hand in the JSON texts below. */
class WeightsFileTest {
  private static final Path FILE = Path.of("dev.weights.json");

  private static WeightsSpec read(String json, String... features) throws IOException {
    return WeightsFile.read(FILE, new StringReader(json), Set.of(features));
  }

  private static WeightsSpec full() {
    WeightsSpec s = new WeightsSpec();
    s.features.put("acoustic", 1.0);
    s.features.put("lm", 0.25);
    s.systemWeights.put("scan-a", 2.0);
    s.lmWeight = 9.5;
    s.oovWeight = -3.0;
    s.lengthWeight = -0.5;
    s.posteriorScale = 0.1;
    s.mbrMaxHypotheses = 50;
    s.latticeLmWeight = 0.3;
    s.latticeLengthWeight = 0.1;
    s.beam = 32;
    s.latticeMaxHypotheses = 150;
    s.unit = Unit.CHAR;
    s.model = new ModelIdentity("dock.arpa", 5, 1234, "ab".repeat(32));
    return s;
  }

  @Test
  void roundTripsEveryValue() throws IOException {
    String json = WeightsFile.toJson(full());
    WeightsSpec back = read(json, "acoustic", "lm");
    assertThat(WeightsFile.toJson(back)).isEqualTo(json);
    RescoreWeights w = back.resolve(List.of("acoustic", "lm"));
    assertThat(w).isEqualTo(full().resolve(List.of("acoustic", "lm")));
    assertThat(back.unit).isEqualTo(Unit.CHAR);
    assertThat(back.model).isEqualTo(full().model);
  }

  @Test
  void optionsOverrideTheFileAndTheFileOverridesDefaults() throws IOException {
    WeightsSpec file = read(WeightsFile.toJson(full()), "acoustic", "lm");
    WeightsSpec options = new WeightsSpec();
    options.lmWeight = 4.0;
    options.features.put("lm", 0.0);
    RescoreWeights w = file.overlay(options).resolve(List.of("acoustic", "lm", "confidence"));
    assertThat(w.lmWeight()).isEqualTo(4.0);
    assertThat(w.features()).containsExactly(
        java.util.Map.entry("acoustic", 1.0), java.util.Map.entry("lm", 0.0), java.util.Map.entry("confidence", 1.0));
    assertThat(w.lengthWeight()).isEqualTo(-0.5);
    assertThat(w.beam()).isEqualTo(32);
    RescoreWeights defaults = new WeightsSpec().resolve(List.of("acoustic"));
    assertThat(defaults).isEqualTo(RescoreWeights.defaults(List.of("acoustic")));
    assertThat(defaults.lmWeight()).isZero();
    assertThat(defaults.posteriorScale()).isEqualTo(1.0);
  }

  @Test
  void anEmptyFeatureSetAcceptsTheFilesFeatureNames() throws IOException {
    WeightsSpec s = read(WeightsFile.toJson(full()));
    assertThat(s.features).containsKeys("acoustic", "lm");
  }

  private static final String HEAD = "{\"format\":\"steelyard-weights\",\"version\":1,\n";

  static Stream<Arguments> badFiles() {
    return Stream.of(
        Arguments.of(HEAD + "\"methods\":{\"nbest\":{\"features\":{\"acustic\":1}}}}", "dev.weights.json:2:33:", "unknown weight name 'acustic'"),
        Arguments.of(HEAD + "\"methods\":{\"nbest\":{\"lm_weight\":\"high\"}}}", "dev.weights.json:2:33:", "'lm_weight' is a string"),
        Arguments.of(HEAD + "\"methods\":{\"nbest\":{\"beam_width\":3}}}", "dev.weights.json:2:", "unknown key 'beam_width'"),
        Arguments.of(HEAD + "\"methods\":{\"lattice\":{\"beam\":2.5}}}", "dev.weights.json:2:", "'beam' is a number"),
        Arguments.of("{\"format\":\"steelyard-weights\",\n\"version\":1,,}", "dev.weights.json:2:13:", "not valid JSON"),
        Arguments.of("lm_weight = 3", "dev.weights.json:1:", "not valid JSON"),
        Arguments.of("{\"format\":\"other\",\"version\":1}", "dev.weights.json:1:", "format is 'other'"));
  }

  @ParameterizedTest(name = "[{index}] {2}")
  @MethodSource("badFiles")
  void badFilesNameTheLineAndColumn(String json, String where, String problem) {
    assertThatThrownBy(() -> read(json, "acoustic"))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith(where)
        .hasMessageContaining(problem);
  }

  @Test
  void aFileWithoutFormatAndVersionIsRefused() {
    assertThatThrownBy(() -> read("{\"methods\":{}}", "acoustic"))
        .isInstanceOf(InputException.class)
        .hasMessageContaining("missing \"format\"");
  }

  @Nested
  class Versions {
    @Test
    void filesAreWrittenAsVersionTwoWithThePosteriorSharpness() {
      String json = WeightsFile.toJson(full());
      assertThat(json).contains("\"version\" : 2", "\"posterior_sharpness\" : 0.1").doesNotContain("posterior_scale");
    }

    @Test
    void aVersionOneFileAsReleaseOneWroteItIsStillRead() throws IOException {
      Path v1 = Path.of("src/test/resources/rescore/dockets-weights-version1.json");
      assertThat(java.nio.file.Files.readString(v1)).contains("\"version\" : 1", "\"posterior_scale\" : 1.0");
      WeightsSpec s = WeightsFile.read(v1, List.of("confidence"));
      assertThat(s.posteriorScale).isEqualTo(1.0);
      assertThat(s.latticeLmWeight).isEqualTo(0.3);
      assertThat(s.latticeLengthWeight).isEqualTo(2.5);
      assertThat(s.unit).isEqualTo(Unit.CHAR);
      assertThat(WeightsFile.toJson(s)).as("saved again, it becomes version 2")
          .contains("\"version\" : 2", "\"posterior_sharpness\" : 1.0").doesNotContain("posterior_scale");
    }

    @Test
    void theVersionMayComeAfterTheKeyItDecides() throws IOException {
      WeightsSpec s = read("{\"format\":\"steelyard-weights\",\"methods\":{\"nbest\":{\"posterior_scale\":0.25}},\"version\":1}");
      assertThat(s.posteriorScale).isEqualTo(0.25);
    }

    // columns counted by hand: the value after "posterior_scale": starts at column 39, after "posterior_sharpness": at 43
    static Stream<Arguments> misspelt() {
      return Stream.of(
          Arguments.of(2, "posterior_scale", "dev.weights.json:2:39: 'posterior_scale' in a version 2 file; expected \"posterior_sharpness\" (\"posterior_scale\" is the version 1 spelling)"),
          Arguments.of(1, "posterior_sharpness", "dev.weights.json:2:43: 'posterior_sharpness' in a version 1 file; expected \"posterior_scale\" in version 1, or \"version\": 2 with \"posterior_sharpness\""));
    }

    @ParameterizedTest(name = "[{index}] version {0} with {1}")
    @MethodSource("misspelt")
    void eachVersionTakesOnlyItsOwnSpelling(int version, String key, String message) {
      String json = "{\"format\":\"steelyard-weights\",\"version\":" + version + ",\n\"methods\":{\"nbest\":{\"" + key + "\":0.5}}}";
      assertThatThrownBy(() -> read(json)).isInstanceOf(InputException.class).hasMessageStartingWith(message);
    }

    @ParameterizedTest(name = "[{index}] version {0}")
    @ValueSource(ints = {0, 4})
    void otherVersionsAreRefused(int version) {
      assertThatThrownBy(() -> read("{\"format\":\"steelyard-weights\",\"version\":" + version + "}"))
          .isInstanceOf(InputException.class)
          .hasMessageContaining("unsupported version " + version + "; expected version 3 (versions 1 and 2 are still read)");
    }
  }

  @Nested
  class TunedWeights {
    private WeightsSpec tuned() {
      WeightsSpec s = full();
      s.method = RescoreMethod.LATTICE;
      s.tuning = new TuningRecord(new TuningRecord.DataFile("dev.nbest.csv", 4096, "cd".repeat(32)),
          new TuningRecord.DataFile("dev.refs.csv", 512, "ef".repeat(32)), 300, 3136, List.of("lm_weight", "lattice_lm_weight"),
          0.0886479591, Double.NaN, 0, 7);
      return s;
    }

    @Test
    void aTunedFileRoundTripsTheMethodAndWhereTheWeightsCameFrom() throws IOException {
      String json = WeightsFile.toJson(tuned());
      WeightsSpec back = read(json, "acoustic", "lm");
      assertThat(WeightsFile.toJson(back)).isEqualTo(json);
      assertThat(back.method).isEqualTo(RescoreMethod.LATTICE);
      assertThat(back.tuning.hypotheses().sameData(tuned().tuning.hypotheses())).isTrue();
      assertThat(back.tuning.references()).isEqualTo(tuned().tuning.references());
      assertThat(back.tuning.utterances()).isEqualTo(300);
      assertThat(back.tuning.referenceTokens()).isEqualTo(3136);
      assertThat(back.tuning.changed()).containsExactly("lm_weight", "lattice_lm_weight");
      assertThat(back.tuning.devErrorRate()).as("six decimals, as every JSON rate").isEqualTo(0.088648);
      assertThat(back.tuning.cvErrorRate()).isNaN();
      assertThat(back.resolve(List.of("acoustic", "lm"))).isEqualTo(full().resolve(List.of("acoustic", "lm")));
    }

    @Test
    void aTunedFileIsVersionThreeAndAPlainOneStaysVersionTwo() {
      assertThat(WeightsFile.toJson(tuned())).contains("\"version\" : 3", "\"method\" : \"lattice\"", "\"tuning\"");
      assertThat(WeightsFile.toJson(full())).contains("\"version\" : 2").doesNotContain("\"method\"", "\"tuning\"");
    }

    @Test
    void aVersionTwoFileAsRescoreSavesItIsStillRead() throws IOException {
      WeightsSpec s = read(WeightsFile.toJson(full()), "acoustic", "lm");
      assertThat(s.method).isNull();
      assertThat(s.tuning).isNull();
      assertThat(s.lmWeight).isEqualTo(9.5);
    }

    // column counted by hand: "method" starts at column 2 of line 2
    @Test
    void theVersionThreeKeysAreRefusedInAnOlderFile() {
      String json = "{\"format\":\"steelyard-weights\",\"version\":2,\n\"method\":\"nbest\"}";
      assertThatThrownBy(() -> read(json)).isInstanceOf(InputException.class)
          .hasMessageStartingWith("dev.weights.json:2:")
          .hasMessageContaining("'method' in a version 2 file; expected \"version\": 3");
    }

    @Test
    void anUnknownMethodIsRefused() {
      String json = "{\"format\":\"steelyard-weights\",\"version\":3,\n\"method\":\"beam\"}";
      assertThatThrownBy(() -> read(json)).isInstanceOf(InputException.class).hasMessageContaining("unknown method 'beam'");
    }

    @Test
    void tuningWithoutItsDevDataIsRefused() {
      String json = "{\"format\":\"steelyard-weights\",\"version\":3,\n\"tuning\":{\"folds\":5}}";
      assertThatThrownBy(() -> read(json)).isInstanceOf(InputException.class).hasMessageContaining("tuning needs its dev data");
    }
  }
}

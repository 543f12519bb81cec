package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class FeatureSpecTest {
  @ParameterizedTest(name = "[{index}] ''{0}'' → {1}")
  @CsvSource(delimiter = '|', value = {
      "acoustic,acoustic | listed twice",
      "acoustic,acoustic:log10 | listed twice",
      ", | empty entry",
      "acoustic,,lm | empty entry",
      "acoustic, | empty entry",
      "acoustic:scale=1:scale=2 | more than one scale",
      "acoustic:ln:cost | more than one convention",
      "conf:linear:scale=-0.01 | negative scale",
      "acoustic:log2 | unknown convention"})
  void refusesSpecsThatWouldCountOrConvertAColumnWrongly(String spec, String rule) {
    assertThatThrownBy(() -> FeatureSpec.parseOption(spec)).isInstanceOf(InputException.class)
        .hasMessageStartingWith("--features: ").hasMessageContaining(rule);
  }

  @Test
  void anEmptyOptionValueIsRefusedButAnAbsentOptionMeansNoFeatures() {
    assertThatThrownBy(() -> FeatureSpec.parseOption("")).hasMessageContaining("the list is empty");
    assertThatThrownBy(() -> FeatureSpec.parseOption("  ")).hasMessageContaining("the list is empty");
    assertThat(FeatureSpec.parseOption(null)).isEmpty();
    assertThat(FeatureSpec.parseList("")).isEmpty();
  }

  @Test
  void aNegativeLinearValueHasNoLogarithmAndIsNeverClamped() {
    FeatureSpec conf = FeatureSpec.parse("conf:linear:scale=0.01");
    assertThat(conf.rawProblem(-3)).contains("negative");
    assertThat(conf.toNaturalLog(-3)).isNaN();
    assertThat(conf.rawProblem(0)).isNull();
    assertThat(conf.toNaturalLog(0)).isEqualTo(FeatureSpec.LINEAR_FLOOR_LN);
    assertThat(conf.toNaturalLog(50)).isEqualTo(Math.log(0.5));
    assertThat(FeatureSpec.parse("acoustic").rawProblem(-3)).isNull();
  }

  @Test
  void parsesOneConventionAndOneScaleInEitherOrder() {
    assertThat(FeatureSpec.parseOption("a:scale=2:log10,b:cost")).containsExactly(
        new FeatureSpec("a", FeatureSpec.Convention.LOG10, 2), new FeatureSpec("b", FeatureSpec.Convention.COST, 1));
    assertThat(List.of(FeatureSpec.parse("c:linear:scale=0.01"))).containsExactly(new FeatureSpec("c", FeatureSpec.Convention.LINEAR, 0.01));
  }
}

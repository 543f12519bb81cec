package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import steelyard.rescore.WeightsFile;

/** The tuner's weight names spell the posterior sharpness as the weights file does. */
class WeightNamesTest {
  @Test
  void theSharpnessIsNamedAsInTheWeightsFile() {
    assertThat(WeightNames.POSTERIOR_SHARPNESS).isEqualTo("posterior_sharpness");
    assertThat(WeightNames.canonical(WeightsFile.POSTERIOR_SHARPNESS_V1)).isEqualTo(WeightNames.POSTERIOR_SHARPNESS);
  }

  @Test
  void otherNamesAreKeptAsGiven() {
    assertThat(WeightNames.canonical(WeightNames.LM)).isEqualTo(WeightNames.LM);
    assertThat(WeightNames.canonical("acoustic")).isEqualTo("acoustic");
  }

  @Test
  void bothSpellingsAreReservedForFeatures() {
    assertThat(WeightNames.isReserved("posterior_sharpness")).isTrue();
    assertThat(WeightNames.isReserved("posterior_scale")).isTrue();
    assertThat(WeightNames.isReserved("acoustic")).isFalse();
  }
}

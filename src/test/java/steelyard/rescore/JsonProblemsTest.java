package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.Set;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.io.InputException;

/** Malformed weights files: one line in the project's words, with no JSON parser internals in it. */
class JsonProblemsTest {
  @ParameterizedTest(name = "[{index}] {0}")
  @ValueSource(strings = {
      "lm_weight = 0.5",
      "{\"format\": x}",
      "{\"format\":",
      "{\"format\": \"a\nb\"}",
      "{\"format\": 1]",
      "{\"format\": 01}",
      "{\"format\" 1}",
      "[1,2",
      "{\u0000}",
      "{'format': 1}",
      "{\"methods\": {\"nbest\": {\"lm_weight\": NaN}}}",
      "{\"a\":1}}",
      "{\"a\": -}",
      "{\"a\": \"\\q\"}",
      "{\"a\": \"\\u12\"}",
      "{\"format\": \"steelyard-weights\", \"format\": \"steelyard-weights\"}"})
  void malformedJsonGivesAMessageWithoutParserInternals(String json) {
    InputException e = catchThrowableOfType(() -> WeightsFile.read(Path.of("w.json"), new StringReader(json), Set.of()), InputException.class);
    assertThat(e).as("an input error for %s", json).isNotNull();
    assertThat(e.getMessage()).startsWith("w.json:").contains("; expected ")
        .doesNotContain("Source:").doesNotContain("REDACTED").doesNotContain("(code ").doesNotContain("`")
        .doesNotContainIgnoringCase("jackson").doesNotContain("Feature").doesNotContain("\n");
  }
}

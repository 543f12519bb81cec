package steelyard.report;

import static org.assertj.core.api.Assertions.assertThatCode;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import steelyard.io.InputException;

class OutputPathsTest {
  private static Map<String, Path> outputs(String json, String csv) {
    Map<String, Path> m = new LinkedHashMap<>();
    m.put("--json", json == null ? null : Path.of(json));
    m.put("--csv", csv == null ? null : Path.of(csv));
    return m;
  }

  @Test
  void refusesAnOutputThatIsAnInputUnderAnotherSpelling() {
    assertThatThrownBy(() -> OutputPaths.refuseClashes(outputs("./data/../refs.csv", null), List.of(Path.of("refs.csv"))))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith("--json: ");
  }

  @Test
  void refusesTwoOutputsOnOneFile() {
    assertThatThrownBy(() -> OutputPaths.refuseClashes(outputs("out.txt", "out.txt"), List.of()))
        .isInstanceOf(InputException.class)
        .hasMessageContaining("--csv");
  }

  @Test
  void refusesTwoOutputsOnStdout() {
    assertThatThrownBy(() -> OutputPaths.refuseClashes(outputs("-", "-"), List.of()))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith("--csv: ");
  }

  @Test
  void acceptsStdoutAndDistinctFiles() {
    assertThatCode(() -> OutputPaths.refuseClashes(outputs("-", "table.csv"), List.of(Path.of("refs.csv"), Path.of("-"))))
        .doesNotThrowAnyException();
  }
}

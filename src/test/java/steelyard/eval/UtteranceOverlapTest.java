package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import steelyard.io.InputException;

class UtteranceOverlapTest {
  private static final Path REFS = Path.of("test.refs.csv");

  @Test
  void noSharedIdIsRefusedNamingBothFilesAndTwoIdsOfEach() {
    assertThatThrownBy(() -> UtteranceOverlap.check("dev.nbest.csv", REFS, List.of("t1", "t2", "t3"), List.of("t1", "t2", "t3"),
        List.of("d1", "d2", "d3")))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith("test.refs.csv: shares no utterance id with dev.nbest.csv (references: 't1', 't2', …; hypotheses: 'd1', 'd2', …)");
  }

  @Test
  void anEmptyHypothesesFileSharesNothingEither() {
    assertThatThrownBy(() -> UtteranceOverlap.check("h.csv", REFS, List.of("t1"), List.of("t1"), List.of()))
        .hasMessageContaining("hypotheses: none");
  }

  @Test
  void lessThanHalfOfEitherSideGivesAWarningWithTheCounts() {
    // 2 of 5 references, 2 of 2 hypothesis utterances
    assertThat(UtteranceOverlap.check("h.csv", REFS, List.of("a", "b", "c", "d", "e"), List.of("c", "d", "e"), List.of()))
        .contains("2 of 5 references (40 %) have hypotheses, 2 of 2 hypothesis utterances (100 %) have references");
    // 2 of 2 references, 2 of 5 hypothesis utterances
    assertThat(UtteranceOverlap.check("h.csv", REFS, List.of("a", "b"), List.of(), List.of("x", "y", "z"))).contains("2 of 5 hypothesis");
  }

  @Test
  void halfOrMoreOnBothSidesIsQuiet() {
    assertThat(UtteranceOverlap.check("h.csv", REFS, List.of("a", "b"), List.of("b"), List.of("x"))).isNull();
    assertThat(UtteranceOverlap.check("h.csv", REFS, List.of(), List.of(), List.of())).isNull();
  }
}

package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class LenientImportTest {
  @TempDir Path dir;

  private static final String FOUR_BAD_ROWS = "utt_id,rank,text,acoustic\n"
      + "u1,1,crates,-1\n"
      + "u1,2,crates,abc\n"        // line 3: bad number
      + "u1,3,crates\n"            // line 4: wrong field count
      + ",1,crates,-1\n"           // line 5: empty utt_id
      + "u1,1,grates,-2\n"         // line 6: duplicate rank
      + "u2,1,pallets,-3\n";

  @Test
  void skipsUpToTheLimitAndListsEachSkippedRowInOrder() {
    Csv.Log log = new Csv.Log();
    Path f = Csv.write(dir, "bad.csv", FOUR_BAD_ROWS);
    List<UtteranceHypotheses> u = Csv.readHyps(f, log.options("acoustic", null, 4));
    assertThat(u).extracting(UtteranceHypotheses::uttId).containsExactly("u1", "u2");
    assertThat(u.get(0).hypotheses()).extracting(Hypothesis::text).containsExactly("crates");
    assertThat(log.skipped).extracting(SkippedRow::line).containsExactly(3L, 4L, 5L, 6L);
    assertThat(log.skipped).extracting(SkippedRow::reason).satisfiesExactly(
        r -> assertThat(r).startsWith("score column 'acoustic' is 'abc'; expected "),
        r -> assertThat(r).startsWith("row has 3 fields but the header has 4; expected "),
        r -> assertThat(r).startsWith("utt_id is empty; expected "),
        r -> assertThat(r).startsWith("duplicate rank 1 for utterance 'u1' (first at line 2); expected "));
    assertThat(log.skipped).allSatisfy(s -> assertThat(s.file()).isEqualTo(f.toString()));
  }

  @Test
  void failsOnTheRowAfterTheLimitSayingSo() {
    Csv.Log log = new Csv.Log();
    Path f = Csv.write(dir, "bad.csv", FOUR_BAD_ROWS);
    assertThatThrownBy(() -> Csv.readHyps(f, log.options("acoustic", null, 3)))
        .isInstanceOf(InputException.class)
        .hasMessage(f + ":6: duplicate rank 1 for utterance 'u1' (first at line 2)"
            + " (bad row 4, more than the 3 allowed by --max-bad-rows); expected each rank once per utterance and system");
    assertThat(log.skipped).hasSize(3);
  }

  @Test
  void strictModeFailsOnTheFirstBadRowAndSkipsNothing() {
    Csv.Log log = new Csv.Log();
    Path f = Csv.write(dir, "bad.csv", FOUR_BAD_ROWS);
    assertThatThrownBy(() -> Csv.readHyps(f, log.options("acoustic", null, 0)))
        .isInstanceOf(InputException.class)
        .hasMessage(f + ":3: score column 'acoustic' is 'abc'; expected a finite decimal number such as -12.5 or 3e-4");
    assertThat(log.skipped).isEmpty();
  }

  @Test
  void structuralProblemsFailEvenWithBudgetLeft() {
    Path f = Csv.write(dir, "split.csv", "utt_id,text\nu1,a\nu2,b\nu1,c\n");
    assertThatThrownBy(() -> Csv.readHyps(f, new Csv.Log().options("", null, 1000)))
        .isInstanceOf(InputException.class)
        .hasMessageStartingWith(f + ":4: rows of utterance 'u1' are not contiguous: first seen at line 2; expected ");
  }

  @Test
  void skippedRowsDoNotBreakContiguity() {
    Csv.Log log = new Csv.Log();
    Path f = Csv.write(dir, "skip.csv", "utt_id,text,a\nu1,x,1\nu2,y,bad\nu1,z,2\n");
    List<UtteranceHypotheses> u = Csv.readHyps(f, log.options("a", null, 1));
    assertThat(u).singleElement().extracting(UtteranceHypotheses::size).isEqualTo(2);
    assertThat(log.skipped).extracting(SkippedRow::line).containsExactly(3L);
  }

  @Test
  void referencesKeepTheFirstOfTwoRowsWithTheSameId() {
    Csv.Log log = new Csv.Log();
    Path f = Csv.write(dir, "refs.csv", "utt_id,text\nu1,first\nu2,other\nu1,second\n");
    var refs = ReferencesReader.readAll(f, log.options("", null, 1));
    assertThat(refs.get("u1").text()).isEqualTo("first");
    assertThat(log.skipped).singleElement().extracting(SkippedRow::line).isEqualTo(4L);
  }
}

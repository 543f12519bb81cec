package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.NoSuchElementException;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HypothesesReaderTest {
  @TempDir Path dir;

  private static final String HEADER = "utt_id,rank,text,acoustic,lm\n";

  @Nested
  class Formats {
    @Test
    void skipsLeadingByteOrderMark() {
      Path f = Csv.writeBytes(dir, "bom.csv", ("\uFEFF" + HEADER + "u1,1,crates,-1,-2\n").getBytes(StandardCharsets.UTF_8));
      try (HypothesesReader r = HypothesesReader.open(f, ImportOptions.strict(List.of()))) {
        assertThat(r.header()).containsExactly("utt_id", "rank", "text", "acoustic", "lm");
        assertThat(r.next().first().uttId()).isEqualTo("u1");
      }
    }

    @Test
    void readsCrlfLineEndsWithoutKeepingCarriageReturns() {
      Path f = Csv.write(dir, "crlf.csv", "utt_id,rank,text,acoustic,lm\r\nu1,1,crates,-1,-2\r\nu1,2,grates,-3,-4\r\n");
      List<UtteranceHypotheses> u = Csv.readHyps(f, "acoustic,lm");
      assertThat(u).hasSize(1);
      assertThat(u.get(0).hypotheses()).extracting(Hypothesis::text).containsExactly("crates", "grates");
      assertThat(u.get(0).hypotheses().get(1).features()).containsExactly(-3.0, -4.0);
    }

    @Test
    void keepsQuotedNewlinesCommasQuotesAndCarriageReturnsAndNumbersRecordStartLines() {
      Path f = Csv.write(dir, "quoted.csv", HEADER
          + "u1,1,\"crates, apples\",-1,-2\n"
          + "u1,2,\"two\nline \"\"note\"\"\",-1,-2\n"
          + "u1,3,\"cr\r\ninside\",-1,-2\n"
          + "u2,1,after,-1,-2\n");
      List<UtteranceHypotheses> u = Csv.readHyps(f, "");
      assertThat(u.get(0).hypotheses()).extracting(Hypothesis::text)
          .containsExactly("crates, apples", "two\nline \"note\"", "cr\r\ninside");
      assertThat(u.get(0).hypotheses()).extracting(Hypothesis::line).containsExactly(2L, 3L, 5L);
      assertThat(u.get(1).first().line()).isEqualTo(7L);
    }

    @Test
    void readsGzippedFiles() {
      Path f = Csv.write(dir, "h.csv.gz", HEADER + "u1,1,crates,-1,-2\nu2,1,pallets,-1,-2\n");
      assertThat(Csv.readHyps(f, "lm")).extracting(UtteranceHypotheses::uttId).containsExactly("u1", "u2");
    }

    @Test
    void acceptsEmptyTextAsEmptyTranscript() {
      Path f = Csv.write(dir, "empty-text.csv", HEADER + "u1,1,,-1,-2\nu1,2,\"\",-1,-2\n");
      assertThat(Csv.readHyps(f, "").get(0).hypotheses()).extracting(Hypothesis::text).containsExactly("", "");
    }

    @Test
    void headerOnlyFileHasZeroUtterances() {
      Path f = Csv.write(dir, "header-only.csv", HEADER);
      try (HypothesesReader r = HypothesesReader.open(f, ImportOptions.strict(List.of()))) {
        assertThat(r.hasNext()).isFalse();
        assertThatThrownBy(r::next).isInstanceOf(NoSuchElementException.class);
      }
    }

    @Test
    void skipsBlankLinesAndIgnoresUnselectedColumnsEvenWhenNotNumeric() {
      Path f = Csv.write(dir, "extra.csv", "utt_id,text,note,lm\n\nu1,crates,not a number,-2\n\n");
      List<UtteranceHypotheses> u = Csv.readHyps(f, "lm");
      assertThat(u).hasSize(1);
      assertThat(u.get(0).first().features()).containsExactly(-2.0);
    }

    @Test
    void deliversEachUtteranceBeforeReadingPastTheNextOnesFirstRow() {
      Path f = Csv.write(dir, "stream.csv", HEADER + "u1,1,a,-1,-2\nu2,1,b,-1,-2\nu2,2,c,-1,oops\n");
      try (HypothesesReader r = HypothesesReader.open(f, ImportOptions.strict(FeatureSpec.parseList("lm")))) {
        assertThat(r.next().uttId()).isEqualTo("u1");
        assertThat(r.rowsRead()).isEqualTo(1);
        assertThatThrownBy(r::next).isInstanceOf(InputException.class).hasMessageStartingWith(f + ":4: score column 'lm' is 'oops'");
      }
    }

    @Test
    void rejectsFieldOverTheCapWithoutReadingItAll() {
      StringBuilder sb = new StringBuilder(HEADER).append("u1,1,\"");
      sb.append("a".repeat(10 * 1024 * 1024)).append("\",-1,-2\n");
      Path f = Csv.write(dir, "huge.csv", sb.toString());
      assertThatThrownBy(() -> Csv.readHyps(f, ""))
          .isInstanceOf(InputException.class)
          .hasMessage(f + ":2: field longer than 1048576 characters; expected shorter fields; is a quote left open?");
    }

    @Test
    void rejectsRowWithThousandsOfFields() {
      Path f = Csv.write(dir, "wide.csv", HEADER + "u1,1" + ",".repeat(10_000) + "\n");
      assertThatThrownBy(() -> Csv.readHyps(f, ""))
          .isInstanceOf(InputException.class)
          .hasMessageStartingWith(f + ":2: row has more than 4096 fields");
    }
  }

  @Nested
  class Ranks {
    @Test
    void usesFileOrderPerSystemWhenThereIsNoRankColumn() {
      Path f = Csv.write(dir, "norank.csv", "utt_id,system,text\nu1,a,x\nu1,b,y\nu1,a,z\nu2,b,w\n");
      List<UtteranceHypotheses> u = Csv.readHyps(f, "");
      assertThat(u.get(0).hypotheses()).extracting(Hypothesis::rank).containsExactly(1, 1, 2);
      assertThat(u.get(0).hypotheses()).extracting(Hypothesis::fileOrder).containsExactly(0, 1, 2);
      assertThat(u.get(0).first().text()).isEqualTo("x");
      assertThat(u.get(1).first().rank()).isEqualTo(1);
    }

    @Test
    void picksSmallestRankEvenWhenItIsNotFirstInFile() {
      Path f = Csv.write(dir, "order.csv", HEADER + "u1,3,c,-1,-2\nu1,1,a,-1,-2\nu1,2,b,-1,-2\n");
      assertThat(Csv.readHyps(f, "").get(0).first().text()).isEqualTo("a");
    }

    @Test
    void warnsOnceSummarisingRankGaps() {
      Csv.Log log = new Csv.Log();
      Path f = Csv.write(dir, "gaps.csv", HEADER
          + "u1,1,a,-1,-2\nu1,2,b,-1,-2\n"
          + "u2,1,a,-1,-2\nu2,4,b,-1,-2\nu2,2,c,-1,-2\n"
          + "u3,2,a,-1,-2\n");
      List<UtteranceHypotheses> u = Csv.readHyps(f, log.options("", null, 0));
      assertThat(u).hasSize(3);
      assertThat(log.warnings).hasSize(1);
      assertThat(log.warnings.get(0))
          .contains("ranks have gaps in 2 utterances")
          .contains("first: utterance 'u2' at line 4, ranks [1, 2, 4]");
      assertThat(u.get(2).first().rank()).isEqualTo(2);
    }

    @Test
    void doesNotWarnWhenRanksAreContiguous() {
      Csv.Log log = new Csv.Log();
      Csv.readHyps(Csv.write(dir, "ok.csv", HEADER + "u1,2,b,-1,-2\nu1,1,a,-1,-2\n"), log.options("", null, 0));
      assertThat(log.warnings).isEmpty();
    }
  }

  @Nested
  class MultiSystem {
    private static final String FILE = "utt_id,system,rank,text\n"
        + "u1,fast,2,f2\nu1,fast,1,f1\nu1,slow,1,s1\n"
        + "u2,slow,1,s1\nu2,fast,1,f1\n";

    @Test
    void tiesBetweenSystemsGoToFileOrderWithoutPrimarySystem() {
      List<UtteranceHypotheses> u = Csv.readHyps(Csv.write(dir, "m.csv", FILE), "");
      assertThat(u.get(0).first().text()).isEqualTo("f1");
      assertThat(u.get(0).recognizerPick()).isEqualTo(1);
      assertThat(u.get(1).first().system()).isEqualTo("slow");
    }

    @Test
    void tiesBetweenSystemsGoToPrimarySystem() {
      Csv.Log log = new Csv.Log();
      List<UtteranceHypotheses> u = Csv.readHyps(Csv.write(dir, "m.csv", FILE), log.options("", "slow", 0));
      assertThat(u).extracting(x -> x.first().system()).containsExactly("slow", "slow");
      assertThat(log.warnings).isEmpty();
    }

    @Test
    void primarySystemDoesNotBeatASmallerRank() {
      Path f = Csv.write(dir, "m2.csv", "utt_id,system,rank,text\nu1,slow,2,s2\nu1,fast,1,f1\n");
      assertThat(Csv.readHyps(f, new Csv.Log().options("", "slow", 0)).get(0).first().text()).isEqualTo("f1");
    }

    @Test
    void warnsWhenPrimarySystemNeverOccurs() {
      Csv.Log log = new Csv.Log();
      Csv.readHyps(Csv.write(dir, "m.csv", FILE), log.options("", "medium", 0));
      assertThat(log.warnings).singleElement().asString().contains("primary system 'medium' does not occur");
    }

    @Test
    void sameRankInDifferentSystemsIsNotADuplicate() {
      try (HypothesesReader r = HypothesesReader.open(Csv.write(dir, "m.csv", FILE), ImportOptions.strict(List.of()))) {
        assertThat(r.hasSystemColumn()).isTrue();
        assertThat(r.next().size()).isEqualTo(3);
      }
    }
  }

  @Nested
  class Features {
    @Test
    void convertsEachConventionToNaturalLog() {
      Path f = Csv.write(dir, "conv.csv", "utt_id,text,a,b,c,d\nu1,x,-2.5,-1,12.5,83\n");
      double[] v = Csv.readHyps(f, "a,b:log10,c:cost,d:linear:scale=0.01").get(0).first().features();
      assertThat(v[0]).isEqualTo(-2.5);
      // log10(x) · ln 10 = ln(x): change of base (mathematical identity).
      assertThat(v[1]).isCloseTo(Math.log(0.1), within(1e-12));
      assertThat(v[2]).isEqualTo(-12.5);
      assertThat(v[3]).isCloseTo(Math.log(0.83), within(1e-12));
    }

    @Test
    void acceptsPlainDecimalForms() {
      Path f = Csv.write(dir, "num.csv", "utt_id,text,a\nu1,x,+1.5e2\nu2,x,.5\nu3,x,-7.\nu4,x, 3 \n");
      assertThat(Csv.readHyps(f, "a")).extracting(u -> u.first().features()[0]).containsExactly(150.0, 0.5, -7.0, 3.0);
    }

    @Test
    void rejectsValueThatOverflowsAfterConversion() {
      Path f = Csv.write(dir, "ovf.csv", "utt_id,text,a\nu1,x,1e308\n");
      assertThatThrownBy(() -> Csv.readHyps(f, "a:log10"))
          .isInstanceOf(InputException.class)
          .hasMessageContaining(":2: score column 'a' value '1e308' is out of range after conversion as a:log10");
    }
  }
}

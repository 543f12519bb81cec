package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;
import static steelyard.history.HistoryFixtures.T0;
import static steelyard.history.HistoryFixtures.at;
import static steelyard.history.HistoryFixtures.file;
import static steelyard.history.HistoryFixtures.rows;
import static steelyard.history.HistoryFixtures.scoreRun;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.io.InputException;
import steelyard.report.CompareReport;
import steelyard.rescore.ModelIdentity;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Unit;

class RunHistoryTest {
  @TempDir Path dir;

  private Path refs() throws IOException {
    return file(dir, "voice-test.refs.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay four\n");
  }

  @Nested
  class Recording {
    @Test
    void aRunReadsBackWithEveryFieldItWasRecordedWith() throws IOException {
      Path hyps = file(dir, "voice-test.nbest.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay for\n");
      Path model = file(dir, "voice.arpa", "\\data\\\n");
      WeightsSpec w = new WeightsSpec();
      w.features.put("acoustic", 1.0);
      w.lmWeight = 12.0;
      w.lengthWeight = 2.5;
      UtteranceCounts u = new UtteranceCounts.Builder(4)
          .add("tpc-v-0001", UtteranceStatus.SCORED, 1, 5)
          .add("tpc-v-0002", UtteranceStatus.MISSING_HYPOTHESIS, 3, 3)
          .add("tpc-v-0003", UtteranceStatus.MISSING_EXCLUDED, 0, 4)
          .add("tpc-v-0009", UtteranceStatus.NO_REFERENCE, 0, 0)
          .build();
      RunRecord run = RunRecord.builder("rescore", T0, at(T0.plusMillis(2750)))
          .commandLine(List.of("rescore", "--hyps", hyps.toString(), "--lm", "voice.arpa"))
          .label("tuned on dev — Tallowmere é 🍐")
          .input(InputFile.HYPOTHESES, hyps, 1)
          .input(InputFile.REFERENCES, refs(), 1)
          .model(model, new ModelIdentity("voice.arpa", 3, 9, "ab".repeat(32)))
          .weights(w)
          .method("nbest")
          .unit(Unit.CHAR, "nfkc fold-case")
          .missingPolicy(MissingHypothesisPolicy.ALL_DELETIONS)
          .totals(new EditCounts(6, 1, 3, 0))
          .interval(new Bootstrap.Interval(0.25, 0.5), 500, 7)
          .utterances(u)
          .warnings(List.of("a warning, with a comma"))
          .build();
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        long id = h.record(run);
        assertThat(h.get(id)).isEqualTo(new StoredRun(id, run));
      }
    }

    @Test
    void timeAndWallTimeComeFromTheInjectedClock() throws IOException {
      RunRecord r = scoreRun(refs(), "first", rows(1, 3), T0).build();
      assertThat(r.startedAt()).isEqualTo(T0);
      assertThat(r.wallMillis()).isEqualTo(1500);
    }

    @Test
    void inputsAreHashedWithSha256() throws IOException {
      // Source: FIPS 180-2, appendix B.1: SHA-256("abc").
      InputFile f = InputFile.of(InputFile.RULES, file(dir, "abc.rules", "abc"), InputFile.UNKNOWN_ROWS);
      assertThat(f.sha256()).isEqualTo("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
      assertThat(f.bytes()).isEqualTo(3);
    }

    @Test
    void idsFollowRecordingOrderAndSeveralRunsGoInOneCall() throws IOException {
      Path refs = refs();
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        assertThat(h.record(scoreRun(refs, "first", rows(1, 3), T0).build())).isEqualTo(1);
        List<Long> ids = h.recordAll(List.of(scoreRun(refs, "first", rows(2, 3), T0).build(), scoreRun(refs, "oracle", rows(3, 3), T0).build()));
        assertThat(ids).containsExactly(2L, 3L);
        assertThat(h.list(RunFilter.ALL)).extracting(RunSummary::id).containsExactly(1L, 2L, 3L);
      }
    }
  }

  @Nested
  class Listing {
    @Test
    void filtersByCommandMethodDataPrefixAndText() throws IOException {
      Path refs = refs();
      Path other = file(dir, "dockets-test.refs.csv", "utt_id,text\nd1,Lot 2231/07 Pears\n");
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        h.record(scoreRun(refs, "first", rows(1, 3), T0).build());
        h.record(scoreRun(other, "oracle", rows(2, 3), T0).label("Dockets Sheet 4").build());
        String sha = h.get(2).run().dataSha256();
        assertThat(h.list(new RunFilter("score", null, null, null))).hasSize(2);
        assertThat(h.list(new RunFilter("rescore", null, null, null))).isEmpty();
        assertThat(h.list(new RunFilter(null, null, "oracle", null))).extracting(RunSummary::id).containsExactly(2L);
        assertThat(h.list(RunFilter.data(sha.substring(0, 8).toUpperCase()))).extracting(RunSummary::id).containsExactly(2L);
        assertThat(h.list(RunFilter.data(sha))).extracting(RunSummary::id).containsExactly(2L);
        assertThat(h.list(new RunFilter(null, null, null, "sheet 4"))).extracting(RunSummary::id).containsExactly(2L);
        assertThat(h.list(new RunFilter(null, null, null, "VOICE-TEST"))).extracting(RunSummary::id).containsExactly(1L);
      }
    }

    @Test
    void theListCarriesRateAndIntervalOfEachRun() throws IOException {
      UtteranceCounts u = rows(5, 40);
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        h.record(scoreRun(refs(), "first", u, T0).build());
        RunSummary s = h.list(RunFilter.ALL).get(0);
        EditCounts t = HistoryFixtures.totals(u);
        assertThat(s.errorRate()).isCloseTo((double) t.errors() / t.referenceTokens(), within(1e-12));
        assertThat(s.utterances()).isEqualTo(40);
        assertThat(s.ci95()).isEqualTo(new Bootstrap.Interval(0.1, 0.2));
        assertThat(s.startedAt()).isEqualTo(T0);
      }
    }

    @Test
    void theErrorSeriesOfOneTestSetFollowsStartTimeNotRecordingOrder() throws IOException {
      Path refs = refs();
      Path other = file(dir, "other.refs.csv", "utt_id,text\nx,y\n");
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        h.record(scoreRun(refs, "first", rows(1, 3), T0.plusSeconds(7200)).build());
        h.record(scoreRun(refs, "first", rows(2, 3), T0).build());
        h.record(scoreRun(other, "first", rows(3, 3), T0.plusSeconds(60)).build());
        h.record(scoreRun(refs, "first", rows(4, 3), T0.plusSeconds(3600)).build());
        assertThat(h.errorSeries(h.get(1).run().dataSha256())).extracting(RunSummary::id).containsExactly(2L, 4L, 1L);
      }
    }

    @Test
    void aMalformedFilterNamesTheOption() {
      assertThatThrownBy(() -> RunFilter.parse(List.of("colour=red"))).isInstanceOf(InputException.class).hasMessageStartingWith("--filter: ");
      assertThatThrownBy(() -> RunFilter.parse(List.of("command"))).isInstanceOf(InputException.class).hasMessageContaining("no value");
    }
  }

  @Nested
  class Weights {
    @Test
    void storedWeightsReadBackAsTheWeightsFileTheRunWouldHaveSaved() throws IOException {
      WeightsSpec w = new WeightsSpec();
      w.features.put("acoustic", 1.0);
      w.features.put("lm", 0.5);
      w.lmWeight = 16.0;
      w.lengthWeight = 8.0;
      w.unit = Unit.WORD;
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        long id = h.record(scoreRun(refs(), "nbest", rows(1, 3), T0).weights(w).build());
        assertThat(h.weightsJson(id)).isEqualTo(WeightsFile.toJson(w));
        assertThat(WeightsFile.toJson(h.weights(id))).isEqualTo(WeightsFile.toJson(w));
      }
    }

    @Test
    void aRunWithoutWeightsOrAnUnknownIdIsAnInputErrorNamingTheFile() throws IOException {
      Path db = dir.resolve("runs.db");
      try (RunHistory h = RunHistory.open(db)) {
        long id = h.record(scoreRun(refs(), "first", rows(1, 3), T0).build());
        assertThatThrownBy(() -> h.weights(id)).isInstanceOf(InputException.class).hasMessageStartingWith(db + ": run 1 has no weights");
        assertThatThrownBy(() -> h.get(99)).isInstanceOf(InputException.class).hasMessageStartingWith(db + ": has no run 99");
      }
    }
  }

  @Nested
  class Comparing {
    @Test
    void pairsUtterancesByIdOverTheRowsBothRunsCount() throws IOException {
      // A: errors 1,1,1,0,0 and B: 0,0,0,1,0 over five utterances; B stored in another order and missing u6 (excluded).
      UtteranceCounts a = new UtteranceCounts.Builder(6).add("u1", UtteranceStatus.SCORED, 1, 3).add("u2", UtteranceStatus.SCORED, 1, 2)
          .add("u3", UtteranceStatus.SCORED, 1, 4).add("u4", UtteranceStatus.SCORED, 0, 2).add("u5", UtteranceStatus.SCORED, 0, 3)
          .add("u6", UtteranceStatus.SCORED, 2, 2).build();
      UtteranceCounts b = new UtteranceCounts.Builder(6).add("u5", UtteranceStatus.SCORED, 0, 3).add("u4", UtteranceStatus.SCORED, 1, 2)
          .add("u3", UtteranceStatus.SCORED, 0, 4).add("u2", UtteranceStatus.SCORED, 0, 2).add("u1", UtteranceStatus.SCORED, 0, 3)
          .add("u6", UtteranceStatus.MISSING_EXCLUDED, 0, 2).build();
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        Path refs = refs();
        h.record(scoreRun(refs, "first", a, T0).build());
        h.record(scoreRun(refs, "first", b, T0).build());
        CompareReport.CompareRun c = h.compare(1, 2, null, 1000, 20261202L, 1);
        // Worked by hand: common set u1..u5, N = 14; A 3 errors, B 1; A better on u4, B better on u1..u3.
        assertThat(c.comparison().utterances()).isEqualTo(5);
        assertThat(c.comparison().referenceTokens()).isEqualTo(14);
        assertThat(c.comparison().difference()).isCloseTo(-2.0 / 14, within(1e-12));
        assertThat(c.comparison().aBetter()).isEqualTo(1);
        assertThat(c.comparison().bBetter()).isEqualTo(3);
        // Worked by hand from the binomial formula: n = 4, k = 1: 2 · (1 + 4) / 16 = 0.625.
        assertThat(c.comparison().signTestP()).isCloseTo(0.625, within(1e-12));
        assertThat(c.a().name()).isEqualTo("run 1");
      }
    }

    @Test
    void runsOnDifferentReferencesAreRefusedNamingBothHashes() throws IOException {
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        h.record(scoreRun(refs(), "first", rows(1, 3), T0).build());
        h.record(scoreRun(file(dir, "other.csv", "utt_id,text\n"), "first", rows(1, 3), T0).build());
        String a = h.get(1).run().dataSha256();
        String b = h.get(2).run().dataSha256();
        assertThatThrownBy(() -> h.compare(1, 2, null, 100, 1, 1)).isInstanceOf(InputException.class)
            .hasMessageContaining("different reference data").hasMessageContaining(a).hasMessageContaining(b);
      }
    }

    @Test
    void runsCountingReferenceTokensDifferentlyAreRefused() throws IOException {
      UtteranceCounts a = new UtteranceCounts.Builder(1).add("u1", UtteranceStatus.SCORED, 1, 3).build();
      UtteranceCounts b = new UtteranceCounts.Builder(1).add("u1", UtteranceStatus.SCORED, 1, 4).build();
      try (RunHistory h = RunHistory.open(dir.resolve("runs.db"))) {
        Path refs = refs();
        h.record(scoreRun(refs, "first", a, T0).build());
        h.record(scoreRun(refs, "first", b, T0).build());
        assertThatThrownBy(() -> h.compare(1, 2, null, 100, 1, 1)).isInstanceOf(InputException.class)
            .hasMessageContaining("'u1' has 3 reference tokens in run 1 and 4 in run 2");
      }
    }
  }
}

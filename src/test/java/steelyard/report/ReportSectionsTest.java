package steelyard.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import steelyard.audit.AuditCounts;
import steelyard.audit.Overrule;
import steelyard.io.FeatureSpec;
import steelyard.report.SectionInput.ChartSeries;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreSummary;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.tune.Sweep;

/**
 * The report mapping on the bundled voice test set with the demo's weights (word N-best, rules making hesitations
 * optional) and on the docket test set (character lattice search). Every check is an identity between two independent
 * computations: the audit against the rescoring summary, the display alignment against the audit's error counts, and
 * the tuner's exact sweep at the weights in effect against the run itself.
 */
class ReportSectionsTest {
  static {
    HeadlessAwt.whenNoDisplay();
  }

  static AuditRun.Result voice;
  static ReportModel.Section section;
  static ChartSeries series;

  @BeforeAll
  static void auditTheVoiceTestSet() {
    RescoreSession session = RescoreSession.open(RescoreConfig.builder().features(FeatureSpec.parseList("acoustic,lm"))
        .weightsFile(Path.of("models/voice-demo.weights.json")).modelPath(Path.of("models/voice-3gram.arpa.gz"))
        .normalisation(new NormalisationOptions(false, false, false, false, Path.of("sample-hypotheses/voice.rules")))
        .method(RescoreMethod.NBEST).build());
    voice = AuditRun.run(session, Path.of("sample-hypotheses/voice-test.nbest.csv"), Path.of("sample-hypotheses/voice-test.refs.csv"),
        2, 1, RescoreSession.LoadListener.NONE, () -> false);
    series = voice.charts(2);
    section = ReportSections.section(voice.section("voice test", "test").charts(series).build());
  }

  @Test
  void summaryCountsAreTheAuditsAndTheNetChangeIsTheCorpusDifference() {
    AuditCounts t = voice.audit().total();
    ReportModel.AuditSummary s = section.summary();
    assertThat(List.of(s.helped(), s.hurt(), s.neutral(), s.unverified()))
        .containsExactly((int) t.helped(), (int) t.hurt(), (int) t.neutral(), (int) t.unverified());
    RescoreSummary r = voice.summary();
    assertThat(s.netErrorChange()).isEqualTo(r.first().errors() - r.chosen().errors()).isPositive();
    assertThat(section.overrules()).hasSize((int) t.overrules()).hasSize((int) r.changed());
  }

  /** The marks on the page add up to the audit's error count of each side (rules' optional tokens left out on both). */
  @Test
  void alignmentMarksAddUpToTheAuditsErrorCounts() {
    List<Overrule> audited = voice.audit().overrules();
    for (int k = 0; k < audited.size(); k++) {
      ReportModel.Overrule row = section.overrules().get(k);
      assertThat(row.uttId()).isEqualTo(audited.get(k).uttId());
      assertThat(marks(row.rankOne())).as(row.uttId() + " rank 1").isEqualTo(audited.get(k).first().errors());
      assertThat(marks(row.pick())).as(row.uttId() + " pick").isEqualTo(audited.get(k).pick().errors());
    }
  }

  private static long marks(ReportModel.AlignedText t) {
    return t.tokens().stream().filter(s -> s.op() != ReportModel.Op.MATCH).count();
  }

  @Test
  void errorRowAndPairedTestAreThoseOfTheRescoringSummary() {
    ReportModel.ErrorRow row = section.figures().errors().get(0);
    RescoreSummary r = voice.summary();
    double n = r.chosen().referenceTokens();
    assertThat(row.chosen().value()).isEqualTo(r.chosen().errors() / n);
    assertThat(row.rankOne().value()).isEqualTo(r.first().errors() / n);
    assertThat(row.chosen().low()).isEqualTo(voice.ci95().low());
    assertThat(row.chosen().high()).isEqualTo(voice.ci95().high());
    assertThat(row.rankOne().hasInterval()).isTrue();
    assertThat(section.figures().pairedTest().better()).isEqualTo(voice.versusFirst().bBetter());
    assertThat(section.figures().pairedTest().bootstrapP()).isBetween(0.0, 1.0);
  }

  @Nested
  class Charts {
    /** The exact sweep, read at the λ in effect, is the run itself: same error, same helped and hurt counts. */
    @Test
    void theCurveAtTheChosenLambdaIsTheRunsErrorRateAndItsHelpedAndHurtCounts() {
      Sweep s = series.lmSweep();
      double lambda = voice.session().weights().lmWeight();
      int j = s.intervalAt(lambda);
      assertThat(j).as("λ in effect is not a breakpoint").isEqualTo(s.intervalAt(Math.nextDown(lambda)));
      ReportModel.WeightCurve curve = section.charts().errorCurve();
      RescoreSummary r = voice.summary();
      double n = r.chosen().referenceTokens();
      assertThat(curve.errorRate()[j]).isEqualTo(r.chosen().errors() / n);
      assertThat(curve.rankOne()).isEqualTo(r.first().errors() / n);
      assertThat(curve.oracle()).isEqualTo(r.oracle().errors() / n);
      assertThat(curve.chosen()).isEqualTo(lambda);
      assertThat(curve.weights()).hasSize(s.intervals() + 1);
      ReportModel.HelpedHurt hh = section.charts().helpedHurt();
      assertThat(hh.helped()[j]).isEqualTo(voice.versusFirst().bBetter());
      assertThat(hh.hurt()[j]).isEqualTo(voice.versusFirst().aBetter());
    }

    @Test
    void theSurfaceAtTheWeightsInEffectIsTheRunsErrorRate() {
      ReportModel.ErrorGrid g = section.charts().surface();
      int x = indexOf(g.xs(), g.chosenX());
      int y = indexOf(g.ys(), g.chosenY());
      assertThat(x).isNotNegative();
      assertThat(y).isNotNegative();
      RescoreSummary r = voice.summary();
      assertThat(g.errorRate()[y][x]).isEqualTo((double) r.chosen().errors() / r.chosen().referenceTokens());
      assertThat(g.xName()).isEqualTo("LM weight λ");
      assertThat(g.yName()).isEqualTo("length weight μ");
    }

    @Test
    void groupRatesWeighTheGroupsBackToTheCorpusRates() {
      long tokens = 0;
      long first = 0;
      long chosen = 0;
      for (SectionInput.GroupCounts g : voice.groups()) {
        tokens += g.referenceTokens();
        first += g.firstErrors();
        chosen += g.chosenErrors();
      }
      assertThat(tokens).isEqualTo(voice.summary().chosen().referenceTokens());
      assertThat(first).isEqualTo(voice.summary().first().errors());
      assertThat(chosen).isEqualTo(voice.summary().chosen().errors());
      assertThat(section.charts().groups().groups()).hasSize(12).first().isEqualTo("spk01");
    }

    private static int indexOf(double[] v, double x) {
      for (int k = 0; k < v.length; k++) if (v[k] == x) return k;
      return -1;
    }
  }

  @Test
  void nbestWeightsListFeaturesLambdaOmegaAndMuOnly() {
    assertThat(section.figures().weights()).extracting(ReportModel.WeightRow::name)
        .containsExactly("feature acoustic", "feature lm", "LM weight λ", "OOV weight ω", "length weight μ");
    assertThat(section.figures().weights().get(2).value()).as("λ of the weights file").isEqualTo(voice.session().weights().lmWeight());
  }

  @Test
  void aTuningResultAddsItsDevRowsItsWarningsAndEachTunedWeightsInterval() {
    steelyard.rescore.RescoreWeights w = voice.session().weights();
    steelyard.tune.TuneResult t = new steelyard.tune.TuneResult(RescoreMethod.NBEST, 0.2267, 0.15, new steelyard.eval.Bootstrap.Interval(0.13, 0.17),
        0.16, 1000, w, java.util.Map.of(steelyard.tune.WeightNames.LM, new steelyard.tune.WeightInterval(14, 18, 16, true)), List.of(), null,
        List.of("over-fitting warning"), 3, 300, 5, 1);
    ReportModel.Section s = ReportSections.section(SectionInput.builder("dev", RescoreMethod.NBEST, w).tuning(t).build());
    assertThat(s.figures().errors()).extracting(ReportModel.ErrorRow::set)
        .containsExactly("dev (in-sample)", "dev (cross-validated, 5 folds)");
    assertThat(s.figures().errors().get(0).chosen().low()).isEqualTo(0.13);
    assertThat(s.notes()).containsExactly("over-fitting warning");
    assertThat(s.figures().weights().get(2).note()).isEqualTo("equally good from 14 to 18 (exact)");
    assertThat(s.figures().weights().get(0).note()).isEmpty();
    assertThat(s.summary()).isNull();
    assertThat(s.charts().groups()).isNull();
    assertThat(s.charts().errorCurve()).isNull();
  }

  @Test
  void characterSectionsShowSpacesAsSpacesAndListTheNetworkWeights() {
    RescoreSession session = RescoreSession.open(RescoreConfig.builder().weightsFile(Path.of("models/dockets-demo.weights.json"))
        .modelPath(Path.of("models/dockets-char-5gram.arpa.gz")).method(RescoreMethod.LATTICE).build());
    AuditRun.Result r = AuditRun.run(session, Path.of("sample-hypotheses/dockets-test.nbest.csv"),
        Path.of("sample-hypotheses/dockets-test.refs.csv"), 2, 1, RescoreSession.LoadListener.NONE, () -> false);
    ReportModel.Section s = ReportSections.section(r.section("dockets", "test").build());
    assertThat(s.errorName()).isEqualTo("CER");
    assertThat(s.overrules()).isNotEmpty();
    List<String> shown = s.overrules().stream().flatMap(o -> o.pick().tokens().stream())
        .map(t -> t.hypothesis() == null ? t.reference() : t.hypothesis()).toList();
    assertThat(shown).contains(" ").doesNotContain(Normaliser.SPACE_TOKEN);
    assertThat(s.overrules()).allMatch(o -> o.flip() == null || !o.flip().exact());
    assertThat(s.figures().weights()).extracting(ReportModel.WeightRow::name)
        .contains("posterior sharpness α", "network LM weight λ′", "network length weight μ′");
    assertThat(s.figures().method()).isEqualTo("lattice");
  }
}

package steelyard.report.html;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import steelyard.report.html.ReportModel.AlignedText;
import steelyard.report.html.ReportModel.AuditSummary;
import steelyard.report.html.ReportModel.ChartData;
import steelyard.report.html.ReportModel.DecisiveNgram;
import steelyard.report.html.ReportModel.ErrorGrid;
import steelyard.report.html.ReportModel.ErrorRow;
import steelyard.report.html.ReportModel.Figures;
import steelyard.report.html.ReportModel.Flip;
import steelyard.report.html.ReportModel.GroupErrors;
import steelyard.report.html.ReportModel.HelpedHurt;
import steelyard.report.html.ReportModel.Overrule;
import steelyard.report.html.ReportModel.PairCount;
import steelyard.report.html.ReportModel.PairedTest;
import steelyard.report.html.ReportModel.Rate;
import steelyard.report.html.ReportModel.Section;
import steelyard.report.html.ReportModel.TokenKind;
import steelyard.report.html.ReportModel.Verdict;
import steelyard.report.html.ReportModel.WeightCurve;
import steelyard.report.html.ReportModel.WeightRow;

/** Small invented report models (Tallowmere voice logs and dockets), one with hostile transcripts. */
final class SampleReports {
  static final String SCRIPT = "<script>document.title='pwned';window.steelyardPwned=1;</script>";
  static final String IMG = "\"><img src=x onerror=\"document.title='pwned'\">";
  static final String AMP_QUOTES = "Fenwick & Sons' \"No. 5\" bay";

  private SampleReports() {}

  static ReportModel small() {
    return new ReportModel("Tallowmere voice logs and dockets", List.of("Demo data: invented."),
        List.of(voice(List.of()), dockets()));
  }

  /** A report whose transcripts, ids, groups, names and notes carry markup and special characters. */
  static ReportModel hostile() {
    TokenAlignment aligner = new TokenAlignment();
    List<String> ref = words("pallet " + IMG + " to bay " + AMP_QUOTES + " " + SCRIPT);
    List<String> one = words("palate " + SCRIPT + " to day");
    List<String> pick = ref;
    Overrule o = new Overrule(SCRIPT, IMG, Verdict.HELPED, 1.25, new Flip("λ" + SCRIPT, 3, 40, true),
        List.of(new DecisiveNgram(AMP_QUOTES, 2.5), new DecisiveNgram(SCRIPT, -0.5)), String.join(" ", ref),
        aligner.align(String.join(" ", one), ref, one), aligner.align(String.join(" ", pick), ref, pick));
    Section s = voice(List.of(o));
    Section hostileSection = new Section(SCRIPT + " " + AMP_QUOTES, "WER", TokenKind.WORDS, List.of(IMG), s.figures(),
        s.charts(), new AuditSummary(1, 0, 0, 0, 3, List.of(new PairCount(SCRIPT, AMP_QUOTES, 2)), List.of()), s.overrules());
    return new ReportModel("Report " + SCRIPT, List.of(IMG, AMP_QUOTES), List.of(hostileSection));
  }

  static Section voice(List<Overrule> extra) {
    Figures figures = new Figures("nbest", List.of(
        new ErrorRow("dev (in-sample)", new Rate(0.2267, 0.2081, 0.2455), new Rate(0.1402, 0.1251, 0.1560), Rate.of(0.1148)),
        new ErrorRow("dev (cross-validated)", new Rate(0.2267, 0.2081, 0.2455), new Rate(0.1460, 0.1302, 0.1621), Rate.of(0.1148)),
        new ErrorRow("test", new Rate(0.2382, 0.2190, 0.2571), new Rate(0.1489, 0.1289, 0.1684), Rate.of(0.1272))),
        new PairedTest("test", 142, 31, 127, 0.0002, 0.00000004),
        List.of(new WeightRow("LM weight λ", 16, "best interval 14.2 to 17.9"), new WeightRow("length weight μ", 8, ""),
            new WeightRow("acoustic", 1, "fixed")));
    double[] lambda = {0, 2, 5, 9, 14, 20, 30};
    ChartData charts = new ChartData(
        new WeightCurve("LM weight λ", lambda, new double[] {0.238, 0.195, 0.161, 0.149, 0.144, 0.158, 0.19}, 0.2382, 0.1272, 16),
        new HelpedHurt("LM weight λ", lambda, new int[] {0, 40, 81, 104, 110, 112, 113}, new int[] {0, 12, 20, 27, 31, 52, 70}, 16),
        grid(), new GroupErrors(List.of("spk01", "spk02", "spk03", "spk04", "spk05"),
            new double[] {0.18, 0.31, 0.22, 0.27, 0.2}, new double[] {0.11, 0.19, 0.15, 0.16, 0.12}));
    TokenAlignment aligner = new TokenAlignment();
    List<Overrule> overrules = new ArrayList<>(extra);
    overrules.add(overrule(aligner, "voice-test-0007", "spk03", Verdict.HELPED, "pallet of pears to bay nine",
        "palate of pairs to day nine", "pallet of pears to bay nine"));
    overrules.add(overrule(aligner, "voice-test-0031", "spk07", Verdict.HURT, "six crates of kiwifruit for brannock farm",
        "six crates of kiwifruit for brannock farm", "six great of kiwi fruit for brannock farm"));
    overrules.add(overrule(aligner, "voice-test-0102", "spk01", Verdict.NEUTRAL, "truck four at dock two",
        "truck for at dock to", "truck four at doc to uh"));
    overrules.add(new Overrule("voice-test-0150", "spk11", Verdict.UNVERIFIED, 0.02, new Flip("λ", 15.9, Double.POSITIVE_INFINITY, true),
        List.of(), null, AlignedText.unaligned("cold store three"), AlignedText.unaligned("coldstore three")));
    return new Section("Voice logs, test", "WER", TokenKind.WORDS, List.of(), figures, charts,
        new AuditSummary(112, 31, 50, 5, 81, List.of(new PairCount("day", "bay", 14), new PairCount("palate", "pallet", 9),
            new PairCount("uh", "", 6)), List.of(new PairCount("crates", "great", 3), new PairCount("", "the", 2))), overrules);
  }

  static Section dockets() {
    Figures figures = new Figures("lattice", List.of(
        new ErrorRow("test", new Rate(0.0558, 0.045, 0.067), new Rate(0.0029, 0.0015, 0.0045), null)),
        null, List.of(new WeightRow("lattice LM weight λ′", 0.3, ""), new WeightRow("posterior scale α", 0.05, "")));
    TokenAlignment aligner = new TokenAlignment();
    List<String> ref = chars("Lot 2231/07");
    List<String> one = chars("Lot 223l/O7");
    List<String> pick = chars("Lot 2231/07");
    Overrule o = new Overrule("dockets-test-0012", "sheet04", Verdict.HELPED, 3.5, new Flip("λ′", 0.12, Double.NaN, false),
        List.of(new DecisiveNgram("2231", 4.1)), "Lot 2231/07", aligner.align("Lot 223l/O7", ref, one), aligner.align("Lot 2231/07", ref, pick));
    return new Section("Delivery dockets, test", "CER", TokenKind.CHARACTERS, List.of("Posteriors were sharpened with α = 0.05."),
        figures, new ChartData(null, null, null, null), null, List.of(o));
  }

  private static Overrule overrule(TokenAlignment a, String id, String group, Verdict v, String ref, String one, String pick) {
    List<String> r = words(ref);
    return new Overrule(id, group, v, 0.84, new Flip("λ", 7.25, 31, true),
        List.of(new DecisiveNgram("to bay nine", 2.31), new DecisiveNgram("pallet of", 1.07), new DecisiveNgram("of pears", -0.4)),
        ref, a.align(one, r, words(one)), a.align(pick, r, words(pick)));
  }

  static ErrorGrid grid() {
    double[] xs = {4, 8, 12, 16, 20, 24};
    double[] ys = {-2, 0, 2, 4, 6, 8};
    double[][] e = new double[ys.length][xs.length];
    for (int iy = 0; iy < ys.length; iy++) {
      for (int ix = 0; ix < xs.length; ix++) e[iy][ix] = 0.14 + 0.0004 * Math.pow(xs[ix] - 16, 2) + 0.002 * Math.pow(ys[iy] - 8, 2) / 4;
    }
    return new ErrorGrid("LM weight λ", "length weight μ", xs, ys, e, 16, 8);
  }

  static List<String> words(String s) {
    return Arrays.asList(s.split(" "));
  }

  static List<String> chars(String s) {
    return s.codePoints().mapToObj(Character::toString).toList();
  }
}

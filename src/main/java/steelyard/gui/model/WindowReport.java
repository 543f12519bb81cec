package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import steelyard.audit.AuditCounts;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.eval.TokenTally;
import steelyard.report.html.ReportModel;
import steelyard.report.html.TokenAlignment;
import steelyard.rescore.RescoreWeights;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * What the window shows, as the HTML report's model ({@link ReportModel}): the corpus figures of the current
 * choice, the weights in effect, the four charts' series and the overrule audit. The figures are in-sample
 * (the open data, with the weights as set); the page says so.
 */
public final class WindowReport {
  private WindowReport() {}

  /** The report of {@code c} over {@code ws} with the charts' series and the audit of the same choice. */
  public static ReportModel model(Workspace ws, Choices c, Sweeps.LambdaSweep sweep, Sweeps.Surface surface, AuditReport audit) {
    Corpus corpus = ws.corpus();
    boolean chars = corpus.unit() == Unit.CHAR;
    CorpusFigures f = c.figures();
    ReportModel.ErrorRow row = new ReportModel.ErrorRow("open data, weights as set (in-sample)", ReportModel.Rate.of(f.firstErrorRate()),
        ReportModel.Rate.of(f.errorRate()), ReportModel.Rate.of(f.oracleErrorRate()));
    ReportModel.PairedTest paired = new ReportModel.PairedTest("open data", f.helped(), f.hurt(), f.scored() - f.helped() - f.hurt(),
        Double.NaN, Double.NaN);
    ReportModel.Figures figures = new ReportModel.Figures(c.method().label(), List.of(row), paired, weights(c.weights()));
    ReportModel.Section section = new ReportModel.Section(ws.request().hyps().getFileName().toString(), chars ? "CER" : "WER",
        chars ? ReportModel.TokenKind.CHARACTERS : ReportModel.TokenKind.WORDS, ws.warnings(), figures, charts(corpus, c, sweep, surface),
        summary(audit.total()), overrules(corpus, audit));
    return new ReportModel("Steelyard: " + ws.request().hyps().getFileName(),
        List.of("Exported from the window: the error rates are measured on the data the weights were set on, so they are optimistic "
            + "for new data."), List.of(section));
  }

  private static List<ReportModel.WeightRow> weights(RescoreWeights w) {
    List<ReportModel.WeightRow> out = new ArrayList<>();
    for (Map.Entry<String, Double> e : w.features().entrySet()) out.add(new ReportModel.WeightRow("feature " + e.getKey(), e.getValue(), ""));
    out.add(new ReportModel.WeightRow("LM weight λ", w.lmWeight(), ""));
    out.add(new ReportModel.WeightRow("OOV weight ω", w.oovWeight(), ""));
    out.add(new ReportModel.WeightRow("length weight μ", w.lengthWeight(), ""));
    out.add(new ReportModel.WeightRow("posterior sharpness α", w.posteriorScale(), ""));
    out.add(new ReportModel.WeightRow("network LM weight λ′", w.latticeLmWeight(), ""));
    out.add(new ReportModel.WeightRow("network length weight μ′", w.latticeLengthWeight(), ""));
    return out;
  }

  private static ReportModel.ChartData charts(Corpus corpus, Choices c, Sweeps.LambdaSweep s, Sweeps.Surface g) {
    ReportModel.WeightCurve curve = new ReportModel.WeightCurve("LM weight λ", s.lambdas(), s.errorRate(), s.firstRate(), s.oracleRate(),
        c.weights().lmWeight());
    ReportModel.HelpedHurt hh = new ReportModel.HelpedHurt("LM weight λ", s.lambdas(), s.helped(), s.hurt(), c.weights().lmWeight());
    double[][] byMu = new double[g.mus().length][g.lambdas().length];
    for (int i = 0; i < g.lambdas().length; i++) for (int j = 0; j < g.mus().length; j++) byMu[j][i] = g.errorRate()[i][j];
    ReportModel.ErrorGrid grid = new ReportModel.ErrorGrid("LM weight λ", "length weight μ", g.lambdas(), g.mus(), byMu,
        c.weights().lmWeight(), c.weights().lengthWeight());
    List<Sweeps.GroupErrors> per = Sweeps.perGroup(corpus, c);
    List<String> names = new ArrayList<>();
    double[] before = new double[per.size()];
    double[] after = new double[per.size()];
    for (int k = 0; k < per.size(); k++) {
      names.add(per.get(k).group().isEmpty() ? "(no group)" : per.get(k).group());
      before[k] = per.get(k).firstRate();
      after[k] = per.get(k).choiceRate();
    }
    return new ReportModel.ChartData(curve, hh, grid, new ReportModel.GroupErrors(names, before, after));
  }

  private static ReportModel.AuditSummary summary(AuditCounts t) {
    return new ReportModel.AuditSummary((int) t.helped(), (int) t.hurt(), (int) t.neutral(), (int) t.unverified(), t.netErrorChange(),
        pairs(t.mostFixed()), pairs(t.mostBroken()));
  }

  private static List<ReportModel.PairCount> pairs(List<TokenTally> tallies) {
    List<ReportModel.PairCount> out = new ArrayList<>();
    for (TokenTally t : tallies) out.add(new ReportModel.PairCount(t.ref() == null ? "" : t.ref(), t.hyp() == null ? "" : t.hyp(), (int) t.count()));
    return out;
  }

  private static List<ReportModel.Overrule> overrules(Corpus corpus, AuditReport audit) {
    TokenAlignment align = new TokenAlignment();
    List<ReportModel.Overrule> out = new ArrayList<>();
    int u = 0;
    for (Overrule o : audit.overrules()) {
      while (!corpus.uttId(u).equals(o.uttId())) u++;
      TokenSequence ref = corpus.referenceTokens(u);
      FlipWeights f = o.flip();
      ReportModel.Flip flip = f == null ? null : new ReportModel.Flip(f.basis() == FlipWeights.Basis.EXACT ? "λ" : "λ′", f.lower(),
          f.returnWeight(), f.basis() == FlipWeights.Basis.EXACT);
      double margin = o.breakdown() != null ? o.breakdown().margin() : o.path() != null ? o.path().margin() : Double.NaN;
      out.add(new ReportModel.Overrule(o.uttId(), o.group(), ReportModel.Verdict.valueOf(o.verdict().name()), margin, flip, decisive(o.ngrams()),
          o.reference(), aligned(align, corpus, u, o.first(), ref), aligned(align, corpus, u, o.pick(), ref)));
    }
    return out;
  }

  /** One side aligned against the reference with the rules' optional tokens left out, as scoring counts them. */
  private static ReportModel.AlignedText aligned(TokenAlignment align, Corpus corpus, int u, Overrule.Side side, TokenSequence ref) {
    if (ref == null) return ReportModel.AlignedText.unaligned(side.text());
    boolean[] optional = side.isNewTranscript() ? new boolean[side.tokens().size()] : corpus.scored(u).tokens(side.index()).optional();
    return align.align(side.text(), required(ref.tokens(), ref.optional()), required(side.tokens(), optional));
  }

  private static List<String> required(List<String> tokens, boolean[] optional) {
    List<String> out = new ArrayList<>(tokens.size());
    for (int k = 0; k < tokens.size(); k++) if (!optional[k]) out.add(tokens.get(k));
    return out;
  }

  private static List<ReportModel.DecisiveNgram> decisive(DecisiveNgrams n) {
    List<ReportModel.DecisiveNgram> out = new ArrayList<>();
    if (n == null) return out;
    for (DecisiveNgrams.Contribution c : n.contributions()) {
      DecisiveNgrams.NgramUse use = c.pick() != null ? c.pick() : c.first();
      out.add(new ReportModel.DecisiveNgram(String.join(" ", use.ngram()), c.difference()));
    }
    return out;
  }
}

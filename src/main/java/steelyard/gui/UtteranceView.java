package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Font;
import java.util.List;
import java.util.Locale;
import javax.swing.BorderFactory;
import javax.swing.Box;
import javax.swing.BoxLayout;
import javax.swing.JCheckBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.JTabbedPane;
import steelyard.gui.model.AlignedPair;
import steelyard.gui.model.Breakdown;
import steelyard.gui.model.Choices;
import steelyard.gui.model.Corpus;
import steelyard.gui.model.HypothesisRow;
import steelyard.gui.model.NetworkPicture;
import steelyard.gui.model.ScoreTerms;
import steelyard.gui.model.Workspace;
import steelyard.report.charts.Charts;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.text.Normaliser;

/**
 * The open utterance: its id, group and verdict; the reference; the pick and rank 1 aligned against it; the
 * hypotheses with every term in their new order; and below, the stacked breakdown of the weighted terms
 * (why the pick won) and the confusion network with the chosen path. EDT only.
 */
final class UtteranceView extends JPanel {
  private static final long serialVersionUID = 1L;
  /** Bars in the breakdown chart (the best totals). */
  static final int MAX_BARS = 12;
  private final JLabel heading = new JLabel("No utterance open");
  private final JLabel reference = new JLabel(" ");
  private final JLabel pick = new JLabel(" ");
  private final AlignmentStrip pickStrip = new AlignmentStrip("detail.align.pick", "pick");
  private final AlignmentStrip firstStrip = new AlignmentStrip("detail.align.first", "rank 1");
  private final HypothesisTable table = new HypothesisTable();
  private final ChartBox breakdown = new ChartBox("detail.breakdown", "Why the pick won: weighted terms", "score-breakdown");
  private final JCheckBox relative = new JCheckBox("relative to the pick", true);
  private final NetworkView network = new NetworkView();
  final JTabbedPane lower = new JTabbedPane();
  final JSplitPane split;
  private List<HypothesisRow> rows = List.of();
  private List<String> terms = List.of();

  UtteranceView() {
    super(new BorderLayout());
    heading.setName("detail.heading");
    heading.setFont(heading.getFont().deriveFont(Font.BOLD, 16f));
    reference.setName("detail.reference");
    pick.setName("detail.pick");
    JPanel top = new JPanel();
    top.setLayout(new BoxLayout(top, BoxLayout.Y_AXIS));
    top.setBorder(BorderFactory.createEmptyBorder(8, 10, 4, 10));
    for (JLabel l : new JLabel[] {heading, reference, pick}) {
      l.setAlignmentX(LEFT_ALIGNMENT);
      top.add(l);
      top.add(Box.createVerticalStrut(3));
    }
    JPanel strips = new JPanel();
    strips.setLayout(new BoxLayout(strips, BoxLayout.Y_AXIS));
    strips.add(pickStrip);
    strips.add(Box.createVerticalStrut(4));
    strips.add(firstStrip);
    JScrollPane stripScroll = new JScrollPane(strips, JScrollPane.VERTICAL_SCROLLBAR_NEVER, JScrollPane.HORIZONTAL_SCROLLBAR_AS_NEEDED);
    stripScroll.setBorder(BorderFactory.createEmptyBorder(4, 0, 4, 0));
    stripScroll.setAlignmentX(LEFT_ALIGNMENT);
    top.add(stripScroll);
    JPanel upper = new JPanel(new BorderLayout());
    upper.add(top, BorderLayout.NORTH);
    upper.add(new JScrollPane(table), BorderLayout.CENTER);

    relative.setName("detail.breakdown.relative");
    relative.setMnemonic('r');
    relative.setToolTipText("Subtract the pick's own terms, so each bar shows by how much, and through which terms, a hypothesis lost.");
    relative.addActionListener(e -> drawBreakdown());
    JPanel chartTab = new JPanel(new BorderLayout());
    chartTab.add(breakdown, BorderLayout.CENTER);
    chartTab.add(relative, BorderLayout.SOUTH);
    lower.setName("detail.lower");
    lower.addTab("Why the pick won", chartTab);
    lower.addTab("Confusion network", new JScrollPane(network));
    lower.setMnemonicAt(0, 'y');
    lower.setMnemonicAt(1, 'k');
    split = new JSplitPane(JSplitPane.VERTICAL_SPLIT, upper, lower);
    split.setResizeWeight(0.55);
    split.setName("detail.split");
    add(split, BorderLayout.CENTER);
  }

  /** Shows utterance {@code u} of {@code ws} chosen as {@code r} under {@code w}. */
  void show(Workspace ws, int u, UtteranceResult r, RescoreWeights w, Choices choices) {
    Corpus corpus = ws.corpus();
    ScoredUtterance s = r.scores();
    Choices.Verdict v = choices.verdict(corpus, u);
    heading.setText("<html>" + UtteranceListPanel.escape(corpus.uttId(u))
        + (corpus.group(u).isEmpty() ? "" : " <span style='color:#6b727c'>· " + UtteranceListPanel.escape(corpus.group(u)) + "</span>")
        + " &nbsp; <span style='color:" + steelyard.report.charts.Palette.hex(Theme.verdict(v)) + "'>" + Theme.verdictText(v)
        + "</span></html>");
    reference.setText(corpus.hasReference(u) ? "Reference: " + corpus.reference(u).text() : "Reference: none (errors cannot be counted)");
    String chosenText = r.isNewTranscript() ? Normaliser.join(r.newTokens(), corpus.unit()) + "  (new: no single hypothesis says this)"
        : r.chosenHypothesis().text();
    pick.setText("Pick: " + chosenText);
    boolean[] pickOptional = r.isNewTranscript() ? null : s.tokens(r.chosen()).optional();
    strip(pickStrip, ws, u, r.chosenTokens(), pickOptional);
    strip(firstStrip, ws, u, s.tokens(s.firstIndex()).tokens(), s.tokens(s.firstIndex()).optional());
    rows = HypothesisRow.of(corpus, u, r);
    terms = ScoreTerms.names(corpus.featureNames());
    table.show(rows, corpus.featureNames(), s.systems().size() > 1);
    drawBreakdown();
    NetworkPicture p = NetworkPicture.of(ws.network(r, w), r.chosen(), r.chosenTokens());
    network.show(p, String.format(Locale.ROOT, "%d hypotheses aligned into %d slots; posteriors at α = %s. The chosen transcript is outlined.",
        s.size(), p.slots().size(), trim(w.posteriorScale())));
  }

  /** Nothing open. */
  void clear() {
    heading.setText("No utterance open");
    reference.setText(" ");
    pick.setText(" ");
    pickStrip.show(List.of());
    firstStrip.show(List.of());
    table.show(List.of(), List.of(), false);
    breakdown.chart(null, null);
    network.show(new NetworkPicture(List.of()), "no network");
  }

  HypothesisTable table() {
    return table;
  }

  String pickText() {
    return pick.getText();
  }

  AlignmentStrip pickStrip() {
    return pickStrip;
  }

  ChartBox breakdown() {
    return breakdown;
  }

  private void drawBreakdown() {
    if (rows.isEmpty()) return;
    Breakdown b = Breakdown.of(rows, terms, relative.isSelected(), MAX_BARS);
    breakdown.chart(Charts.scoreBreakdown(b.labels(), b.terms(), b.values()),
        b.relative() ? "Each bar: a hypothesis's weighted terms minus the pick's (natural log); left of zero is where it lost."
            : "Each bar: a hypothesis's weighted terms (natural log); the longest total to the right wins under N-best.");
  }

  private static void strip(AlignmentStrip strip, Workspace ws, int u, List<String> tokens, boolean[] optional) {
    var a = ws.align(u, tokens, optional);
    strip.show(a == null ? List.of() : AlignedPair.columns(a, ws.corpus().referenceTokens(u), tokens, optional));
  }

  private static String trim(double v) {
    return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
  }
}

package steelyard.report.html;

import java.util.List;
import java.util.Objects;

/**
 * Everything the HTML report shows, as plain values: the report's input model. The tuner and the audit map
 * their results onto it; {@link HtmlReport} renders it. Nothing here computes.
 *
 * <p>Units: every error rate is a fraction (0.2382 is 23.82 %); intervals are 95 % intervals as fractions
 * (NaN ends: no interval); scores, margins and n-gram contributions are natural-log units, higher is better;
 * a NaN number prints as "n/a" and an absent optional part (null) is left out of the page. Lists are copied;
 * arrays are copied on construction and must not be modified through the accessors.
 *
 * @param title    page title, e.g. "Tallowmere voice logs: tuned rescoring"
 * @param notes    run-wide notes shown under the title (warnings, provenance); may be empty
 * @param sections one section per data set, in page order
 */
public record ReportModel(String title, List<String> notes, List<Section> sections) {
  /** Printed at the top of every report, whatever the model says. */
  public static final String REVIEW_NOTICE = "An automatic pick is not a verified transcript; transcripts with legal, "
      + "medical or safety weight need review by a person.";

  public ReportModel {
    Objects.requireNonNull(title, "title");
    notes = List.copyOf(notes);
    sections = List.copyOf(sections);
  }

  /**
   * One data set, e.g. "Voice logs, test".
   *
   * @param name      heading of the section
   * @param errorName the error measure, "WER" or "CER"
   * @param tokens    what a token is (words are shown with spaces between them, characters without)
   * @param notes     notes for this data set (warnings such as collapsed posteriors); may be empty
   * @param figures   error rates, paired test, method and weights
   * @param charts    the charts; any of its parts may be null
   * @param summary   counts of overrules by verdict and the most often fixed and broken pairs; null: no audit
   * @param overrules every utterance whose pick differs from rank 1, in display order
   */
  public record Section(String name, String errorName, TokenKind tokens, List<String> notes, Figures figures,
      ChartData charts, AuditSummary summary, List<Overrule> overrules) {
    public Section {
      Objects.requireNonNull(name, "name");
      Objects.requireNonNull(errorName, "errorName");
      Objects.requireNonNull(tokens, "tokens");
      notes = List.copyOf(notes);
      Objects.requireNonNull(figures, "figures");
      charts = charts == null ? ChartData.NONE : charts;
      overrules = List.copyOf(overrules);
    }
  }

  /** What a token of the alignment is. */
  public enum TokenKind { WORDS, CHARACTERS }

  /**
   * The run's figures.
   *
   * @param method     the rescoring method chosen, e.g. "nbest" or "lattice"
   * @param errors     one row per data set and way of measuring (dev in-sample, dev cross-validated, test)
   * @param pairedTest the paired comparison of the picks against rank 1; null: not run
   * @param weights    the chosen weights
   */
  public record Figures(String method, List<ErrorRow> errors, PairedTest pairedTest, List<WeightRow> weights) {
    public Figures {
      Objects.requireNonNull(method, "method");
      errors = List.copyOf(errors);
      weights = List.copyOf(weights);
    }
  }

  /**
   * Error rates of one data set.
   *
   * @param set    what was measured, e.g. "dev (cross-validated)" or "test"
   * @param rankOne the recogniser's rank 1
   * @param chosen the picks with the chosen weights
   * @param oracle the best hypothesis in each list; null: not known
   */
  public record ErrorRow(String set, Rate rankOne, Rate chosen, Rate oracle) {
    public ErrorRow {
      Objects.requireNonNull(set, "set");
      Objects.requireNonNull(rankOne, "rankOne");
      Objects.requireNonNull(chosen, "chosen");
    }
  }

  /** An error rate (fraction) with its 95 % interval (fractions; NaN ends: no interval). */
  public record Rate(double value, double low, double high) {
    /** A rate without an interval. */
    public static Rate of(double value) {
      return new Rate(value, Double.NaN, Double.NaN);
    }

    /** Whether both ends of the interval are known. */
    public boolean hasInterval() {
      return !Double.isNaN(low) && !Double.isNaN(high);
    }
  }

  /**
   * Utterance-level paired comparison of the picks against rank 1 on one data set.
   *
   * @param set        the data set, e.g. "test"
   * @param better     utterances with fewer errors than rank 1
   * @param worse      utterances with more errors
   * @param tied       utterances with as many errors
   * @param bootstrapP two-sided p-value of the paired bootstrap (NaN: not run)
   * @param signP      two-sided p-value of the sign test (NaN: not run)
   */
  public record PairedTest(String set, int better, int worse, int tied, double bootstrapP, double signP) {}

  /**
   * One chosen weight.
   *
   * @param name  e.g. "LM weight λ"
   * @param value the weight
   * @param note  e.g. the interval of equally good values, or "fixed"; may be empty
   */
  public record WeightRow(String name, double value, String note) {
    public WeightRow {
      Objects.requireNonNull(name, "name");
      note = note == null ? "" : note;
    }
  }

  /** The section's charts; any part may be null and is then left out. */
  public record ChartData(WeightCurve errorCurve, HelpedHurt helpedHurt, ErrorGrid surface, GroupErrors groups) {
    /** No charts at all. */
    public static final ChartData NONE = new ChartData(null, null, null, null);
  }

  /**
   * Corpus error rate along one weight, a step function: {@code errorRate[k]} holds from {@code weights[k]} to
   * {@code weights[k+1]}.
   */
  public record WeightCurve(String weightName, double[] weights, double[] errorRate, double rankOne, double oracle,
      double chosen) {
    public WeightCurve {
      weights = weights.clone();
      errorRate = errorRate.clone();
    }
  }

  /** Counts of overrules that helped and hurt at each weight (a count holds up to the next weight). */
  public record HelpedHurt(String weightName, double[] weights, int[] helped, int[] hurt, double chosen) {
    public HelpedHurt {
      weights = weights.clone();
      helped = helped.clone();
      hurt = hurt.clone();
    }
  }

  /** Corpus error rate over a grid of two weights, indexed {@code errorRate[iy][ix]}. */
  public record ErrorGrid(String xName, String yName, double[] xs, double[] ys, double[][] errorRate, double chosenX,
      double chosenY) {
    public ErrorGrid {
      xs = xs.clone();
      ys = ys.clone();
      double[][] copy = new double[errorRate.length][];
      for (int k = 0; k < copy.length; k++) copy[k] = errorRate[k].clone();
      errorRate = copy;
    }
  }

  /** Error rate of rank 1 and of the picks per group (speaker, sheet). */
  public record GroupErrors(List<String> groups, double[] rankOne, double[] chosen) {
    public GroupErrors {
      groups = List.copyOf(groups);
      rankOne = rankOne.clone();
      chosen = chosen.clone();
    }
  }

  /**
   * Overrules by verdict.
   *
   * @param netErrorChange Σ over overrules of errors(rank 1) − errors(pick): positive means fewer errors
   * @param fixed          token pairs most often fixed by overrules (rank 1 had {@code from}, the pick {@code to})
   * @param broken         token pairs most often broken
   */
  public record AuditSummary(int helped, int hurt, int neutral, int unverified, long netErrorChange,
      List<PairCount> fixed, List<PairCount> broken) {
    public AuditSummary {
      fixed = List.copyOf(fixed);
      broken = List.copyOf(broken);
    }
  }

  /** A token pair and how often it occurred; an empty side means "nothing" (an insertion or a deletion). */
  public record PairCount(String from, String to, int count) {}

  /**
   * One overrule: an utterance whose pick differs from rank 1.
   *
   * @param uttId     utterance id
   * @param group     group (speaker, sheet); may be empty
   * @param verdict   helped, hurt, neutral or unverified
   * @param margin    total score of the pick minus that of rank 1 at the chosen weights (natural log, ≥ 0)
   * @param flip      where along the LM weight the pick holds; null: not computed
   * @param decisive  the n-grams that decided it, largest first
   * @param reference the reference transcript; null: none (unverified)
   * @param rankOne   the recogniser's rank 1, aligned against the reference
   * @param pick      the pick, aligned against the reference
   */
  public record Overrule(String uttId, String group, Verdict verdict, double margin, Flip flip,
      List<DecisiveNgram> decisive, String reference, AlignedText rankOne, AlignedText pick) {
    public Overrule {
      Objects.requireNonNull(uttId, "uttId");
      group = group == null ? "" : group;
      Objects.requireNonNull(verdict, "verdict");
      decisive = List.copyOf(decisive);
      Objects.requireNonNull(rankOne, "rankOne");
      Objects.requireNonNull(pick, "pick");
    }
  }

  /** The pick compared with rank 1 against the reference. */
  public enum Verdict { HELPED, HURT, NEUTRAL, UNVERIFIED }

  /**
   * The interval of the LM weight on which the pick beats rank 1 (the other weights fixed).
   *
   * @param weightName e.g. "λ" or "λ′"
   * @param from       where the decision turns to the pick (−∞ or NaN: no lower end)
   * @param to         where it returns to rank 1 (+∞ or NaN: never)
   * @param exact      true when computed exactly; false when computed on a pool of search paths
   */
  public record Flip(String weightName, double from, double to, boolean exact) {}

  /**
   * An n-gram the decision rested on.
   *
   * @param text  the n-gram, e.g. "bay five"
   * @param delta its contribution to ln P(pick) − ln P(rank 1) (natural log): positive favours the pick
   */
  public record DecisiveNgram(String text, double delta) {}

  /**
   * A hypothesis's text and its alignment against the reference.
   *
   * @param text   the hypothesis as shown to users
   * @param tokens the alignment, in reading order; empty when there is no reference
   * @param errors S + D + I against the reference; −1 when there is no reference
   */
  public record AlignedText(String text, List<AlignedToken> tokens, int errors) {
    public AlignedText {
      Objects.requireNonNull(text, "text");
      tokens = List.copyOf(tokens);
    }

    /** A text with no reference to align against. */
    public static AlignedText unaligned(String text) {
      return new AlignedText(text, List.of(), -1);
    }
  }

  /**
   * One step of an alignment.
   *
   * @param op         what happened to this token
   * @param reference  the reference token; null for an insertion
   * @param hypothesis the hypothesis token; null for a deletion
   */
  public record AlignedToken(Op op, String reference, String hypothesis) {
    public AlignedToken {
      Objects.requireNonNull(op, "op");
      if (op != Op.INSERTION) Objects.requireNonNull(reference, "reference");
      if (op != Op.DELETION) Objects.requireNonNull(hypothesis, "hypothesis");
    }
  }

  /** Alignment operations: match, substitution, deletion (missing from the hypothesis), insertion (extra). */
  public enum Op { MATCH, SUBSTITUTION, DELETION, INSERTION }
}

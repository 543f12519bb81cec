package steelyard.history;

import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import steelyard.report.Numbers;
import steelyard.report.ReportText;

/** The plain-text run list and run details of the {@code runs} commands. */
public final class RunText {
  /** Hex digits of a SHA-256 shown in the run list (enough to tell test sets apart, and to filter on). */
  public static final int SHORT_HASH = 12;
  private static final DateTimeFormatter MILLIS = DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss.SSS").withZone(ZoneOffset.UTC);

  private RunText() {}

  /** One line per run: id, start (UTC), command, data (references hash), method, error rate and interval, label. */
  public static String table(List<RunSummary> runs) {
    // Padded by hand rather than with String.format: ten thousand runs render in tens of milliseconds.
    StringBuilder sb = new StringBuilder(96 * (runs.size() + 2));
    row(sb, "id", "started (UTC)", "command", "data", "method", "error", "95% interval", "label");
    for (RunSummary r : runs) {
      String rate = ReportText.rateName(r.unit()) + " " + Numbers.percent(r.errorRate(), 2);
      row(sb, Long.toString(r.id()), minute(r.startedAt()), r.command(), shortHash(r.dataSha256()), r.method(), rate,
          interval(r.ci95().low(), r.ci95().high()), r.label() == null ? "" : r.label());
    }
    sb.append(runs.size()).append(runs.size() == 1 ? " run" : " runs").append('\n');
    if (!runs.isEmpty()) sb.append(ReportText.REVIEW_NOTE).append('\n');
    return sb.toString();
  }

  private static final int[] WIDTHS = {6, 16, 8, 12, 9, 11, 17};

  // The id right-aligned, every other column left-aligned, two spaces between columns, the label last and unpadded.
  private static void row(StringBuilder sb, String... cells) {
    sb.append(" ".repeat(Math.max(0, WIDTHS[0] - cells[0].length()))).append(cells[0]);
    for (int i = 1; i < cells.length; i++) {
      sb.append("  ").append(cells[i]);
      if (i < WIDTHS.length) sb.append(" ".repeat(Math.max(0, WIDTHS[i] - cells[i].length())));
    }
    int end = sb.length();
    while (end > 0 && sb.charAt(end - 1) == ' ') end--;
    sb.setLength(end);
    sb.append('\n');
  }

  // uuuu-MM-dd HH:mm in UTC.
  private static String minute(Instant t) {
    LocalDateTime d = LocalDateTime.ofEpochSecond(t.getEpochSecond(), 0, ZoneOffset.UTC);
    return d.getYear() + "-" + two(d.getMonthValue()) + "-" + two(d.getDayOfMonth()) + " " + two(d.getHour()) + ":" + two(d.getMinute());
  }

  private static String two(int v) {
    return v < 10 ? "0" + v : Integer.toString(v);
  }

  /** Everything about one run, its weights last. */
  public static String details(StoredRun s) {
    RunRecord r = s.run();
    StringBuilder sb = new StringBuilder();
    line(sb, "Run " + s.id() + " (" + r.command() + "), started " + MILLIS.format(r.startedAt()) + " UTC, took "
        + Numbers.fixed(r.wallMillis() / 1000.0, 3) + " s, steelyard " + r.toolVersion());
    line(sb, "  command line  steelyard " + commandLine(r.commandLine()));
    if (r.label() != null) line(sb, "  label         " + r.label());
    for (InputFile f : r.inputs())
      line(sb, "  " + pad(f.role(), 12) + "  " + f.path() + "  (" + (f.rows() < 0 ? "" : f.rows() + " rows, ") + f.bytes()
          + " bytes, sha256 " + f.sha256() + ")");
    if (r.model() != null)
      line(sb, "  model         " + r.model().file() + "  (order " + r.model().order() + ", " + r.model().bytes() + " bytes, sha256 "
          + r.model().sha256() + ")");
    line(sb, "  method        " + r.method() + ", unit " + ReportText.unitLabel(r.unit())
        + (r.missingPolicy() == null ? "" : ", references without a hypothesis: " + r.missingPolicy().label()));
    if (r.normalisation() != null) line(sb, "  normalised    " + r.normalisation());
    scores(sb, r);
    if (!r.warnings().isEmpty()) {
      line(sb, "  warnings");
      for (String w : r.warnings()) line(sb, "    - " + w);
    }
    if (r.weightsJson() != null) {
      line(sb, "  weights (write them to a file with 'steelyard runs weights " + s.id() + " --out FILE')");
      for (String l : r.weightsJson().split("\n")) line(sb, "    " + l);
    }
    line(sb, ReportText.REVIEW_NOTE);
    return sb.toString();
  }

  private static void scores(StringBuilder sb, RunRecord r) {
    String rate = ReportText.rateName(r.unit());
    String interval = r.resamples() == 0 ? "" : "   95% interval " + interval(r.ci95().low(), r.ci95().high())
        + "   (bootstrap over utterances, " + r.resamples() + " resamples, seed " + r.seed() + ")";
    line(sb, "  " + rate + " " + Numbers.percent(r.errorRate(), 2) + interval);
    var t = r.totals();
    line(sb, "  " + t.errors() + " errors in " + t.referenceTokens() + " reference " + ReportText.tokenNoun(r.unit()) + ": "
        + t.substitutions() + " substituted, " + t.deletions() + " deleted, " + t.insertions() + " inserted; " + t.correct() + " correct");
    UtteranceCounts u = r.utterances();
    line(sb, "  per-utterance rows  " + u.size() + ": " + u.includedCount() + " counted, "
        + (u.idsWith(UtteranceStatus.MISSING_HYPOTHESIS).size() + u.idsWith(UtteranceStatus.MISSING_EXCLUDED).size())
        + " references without a hypothesis, " + u.idsWith(UtteranceStatus.NO_REFERENCE).size() + " hypothesis utterances without a reference");
  }

  /** The arguments as one line a POSIX shell would split back into the same arguments. */
  public static String commandLine(List<String> args) {
    StringBuilder sb = new StringBuilder();
    for (String a : args) {
      if (sb.length() > 0) sb.append(' ');
      sb.append(a.matches("[A-Za-z0-9_./:=,@%+-]+") ? a : "'" + a.replace("'", "'\\''") + "'");
    }
    return sb.toString();
  }

  /** The first {@value #SHORT_HASH} hex digits, or {@code -} when there is no hash. */
  public static String shortHash(String sha256) {
    return sha256 == null ? "-" : sha256.substring(0, Math.min(SHORT_HASH, sha256.length()));
  }

  private static String interval(double low, double high) {
    if (Double.isNaN(low) && Double.isNaN(high)) return "";
    return Numbers.percent(low, 2) + " to " + Numbers.percent(high, 2);
  }

  private static String pad(String s, int width) {
    return s.length() >= width ? s : s + " ".repeat(width - s.length());
  }

  private static void line(StringBuilder sb, String s) {
    sb.append(s).append('\n');
  }
}

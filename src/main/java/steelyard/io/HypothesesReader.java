package steelyard.io;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2LongOpenHashMap;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.io.Closeable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;

/**
 * Streams a hypotheses CSV file one utterance at a time; memory does not grow with file size.
 *
 * <p>Contract (documented in the README): header row required; columns {@code utt_id} and {@code text}
 * required, {@code system}, {@code rank}, {@code group} optional, any other column kept unread unless it is
 * named as a feature. Rows of one utterance are contiguous: an {@code utt_id} that reappears after another
 * utterance is an {@link InputException}. {@code rank} is unique per (utt_id, system). Bad input throws
 * {@link InputException} only (or is skipped and reported in lenient mode).
 *
 * <pre>{@code
 * try (HypothesesReader r = HypothesesReader.open(path, ImportOptions.strict(features))) {
 *   while (r.hasNext()) { UtteranceHypotheses u = r.next(); ... }
 * }
 * }</pre>
 *
 * <p>Row-level problems (wrong field count, stray quote, empty {@code utt_id}, bad rank, bad score, duplicate
 * rank) go through the lenient-mode budget; structural ones (header, contiguity, encoding, a quote open at
 * end of file) always fail. Memory: the current and the next utterance's rows, plus 32 to 64 bytes per
 * finished utterance id for the contiguity check (see {@link UttIdLedger}).
 *
 * <p>Not thread-safe.
 */
public final class HypothesesReader implements Closeable, Iterator<UtteranceHypotheses> {
  static final String EXPECTED_HEADER =
      "a header row with columns utt_id,text and optionally system,rank,group and score columns";
  private static final int SHOWN_VALUE_CHARS = 40;

  private final Path file;
  private final ImportOptions options;
  private final CsvRecordReader csv;
  private final CsvHeader header;
  private final int colUtt;
  private final int colText;
  private final int colSystem;
  private final int colRank;
  private final int colGroup;
  private final int[] featureCols;
  private final BadRows bad;
  private final UttIdLedger ledger = new UttIdLedger();
  private final RankGaps gaps;
  private final Object2IntOpenHashMap<String> systems = new Object2IntOpenHashMap<>();
  private final Long2LongOpenHashMap rankLines = new Long2LongOpenHashMap();
  private final IntArrayList rankCounters = new IntArrayList();

  private Row pending;
  private UtteranceHypotheses ready;
  private boolean finished;
  private boolean primarySeen;
  private long rows;

  /** One well-formed row, before it is placed in its utterance; rank 0 = no rank column. */
  private record Row(String utt, String system, int rank, String text, double[] features, String group, long line) {}

  private HypothesesReader(Path file, ImportOptions options, CsvRecordReader csv) {
    this.file = file;
    this.options = options;
    this.csv = csv;
    this.header = CsvHeader.read(file, csv, EXPECTED_HEADER);
    this.colUtt = header.required("utt_id");
    this.colText = header.required("text");
    this.colSystem = header.optional("system");
    this.colRank = header.optional("rank");
    this.colGroup = header.optional("group");
    List<FeatureSpec> features = options.features();
    this.featureCols = new int[features.size()];
    for (int j = 0; j < featureCols.length; j++) featureCols[j] = header.feature(features.get(j).name());
    boolean[] keep = new boolean[header.width()];
    for (int c : new int[] {colUtt, colText, colSystem, colRank, colGroup}) if (c >= 0) keep[c] = true;
    for (int c : featureCols) keep[c] = true;
    csv.keepOnly(keep);
    this.bad = new BadRows(file, options);
    this.gaps = new RankGaps(file);
    systems.defaultReturnValue(-1);
  }

  /** Opens a plain, gzipped ({@code .gz}) file; UTF-8 with or without BOM; LF or CRLF. */
  public static HypothesesReader open(Path file, ImportOptions options) {
    CsvRecordReader csv = new CsvRecordReader(file, InputFiles.openUnbuffered(file));
    try {
      return new HypothesesReader(file, options, csv);
    } catch (RuntimeException e) {
      csv.close();
      throw e;
    }
  }

  /** The header row's column names, in file order. */
  public List<String> header() {
    return header.names();
  }

  /** Whether the file has a {@code system} column. */
  public boolean hasSystemColumn() {
    return colSystem >= 0;
  }

  /** Whether the file has a {@code rank} column (otherwise ranks are file order within utterance and system). */
  public boolean hasRankColumn() {
    return colRank >= 0;
  }

  /** Hypothesis rows delivered so far (skipped rows not counted). */
  public long rowsRead() {
    return rows;
  }

  /** Rows skipped so far in lenient mode. */
  public int rowsSkipped() {
    return bad.count();
  }

  @Override
  public boolean hasNext() {
    if (ready == null && !finished) {
      ready = readUtterance();
      if (ready == null) finish();
    }
    return ready != null;
  }

  @Override
  public UtteranceHypotheses next() {
    if (!hasNext()) throw new NoSuchElementException("no more utterances in " + file);
    UtteranceHypotheses u = ready;
    ready = null;
    return u;
  }

  @Override
  public void close() {
    csv.close();
  }

  private UtteranceHypotheses readUtterance() {
    Row first = pending != null ? pending : nextRow();
    pending = null;
    if (first == null) return null;
    long seen = ledger.addIfAbsent(first.utt(), first.line());
    if (seen != 0) {
      throw InputException.at(file, first.line(),
          "rows of utterance '" + shown(first.utt()) + "' are not contiguous: first seen at line " + seen,
          "all rows of an utterance next to each other (group the file by utt_id, keeping row order)");
    }
    rankLines.clear();
    rankCounters.clear();
    List<Hypothesis> hyps = new ArrayList<>();
    place(hyps, first);
    Row r;
    while ((r = nextRow()) != null) {
      if (!r.utt().equals(first.utt())) {
        pending = r;
        break;
      }
      place(hyps, r);
    }
    if (colRank >= 0) gaps.check(hyps);
    rows += hyps.size();
    return new UtteranceHypotheses(first.utt(), hyps, recognizerPick(hyps));
  }

  /** Assigns the rank (file order when there is no rank column) and rejects a duplicate rank. */
  private void place(List<Hypothesis> hyps, Row r) {
    int sys = systems.getInt(r.system());
    if (sys < 0) {
      sys = systems.size();
      systems.put(r.system(), sys);
    }
    while (rankCounters.size() <= sys) rankCounters.add(0);
    int rank = r.rank();
    if (rank == 0) {
      rank = rankCounters.getInt(sys) + 1;
      rankCounters.set(sys, rank);
    }
    long key = ((long) sys << 32) | rank;
    long earlier = rankLines.putIfAbsent(key, r.line());
    if (earlier != 0) {
      String who = colSystem >= 0 ? "utterance '" + shown(r.utt()) + "', system '" + shown(r.system()) + "'" : "utterance '" + shown(r.utt()) + "'";
      bad.reject(r.line(), "duplicate rank " + rank + " for " + who + " (first at line " + earlier + ")",
          "each rank once per utterance and system");
      return;
    }
    hyps.add(new Hypothesis(r.utt(), r.system(), rank, r.text(), r.features(), r.group(), hyps.size(), r.line()));
  }

  private int recognizerPick(List<Hypothesis> hyps) {
    String primary = options.primarySystem();
    int best = 0;
    boolean bestPrimary = primary != null && primary.equals(hyps.get(0).system());
    for (int i = 1; i < hyps.size(); i++) {
      Hypothesis h = hyps.get(i);
      boolean isPrimary = primary != null && primary.equals(h.system());
      int rb = hyps.get(best).rank();
      if (h.rank() < rb || (h.rank() == rb && isPrimary && !bestPrimary)) {
        best = i;
        bestPrimary = isPrimary;
      }
    }
    if (bestPrimary) primarySeen = true;
    else if (primary != null && !primarySeen) for (Hypothesis h : hyps) primarySeen |= primary.equals(h.system());
    return best;
  }

  /** The next well-formed row; malformed ones go through the lenient-mode budget. Null at end of file. */
  private Row nextRow() {
    while (csv.next()) {
      try {
        return parseRow();
      } catch (BadRows.RowProblem p) {
        bad.reject(csv.line(), p.getMessage(), p.expected);
      }
    }
    return null;
  }

  private Row parseRow() throws BadRows.RowProblem {
    if (csv.problem() != null) throw new BadRows.RowProblem(csv.problem(), csv.problemExpected());
    if (csv.size() != header.width()) {
      throw new BadRows.RowProblem("row has " + csv.size() + " fields but the header has " + header.width(),
          header.width() + " comma-separated fields; put a field that contains a comma in double quotes");
    }
    String utt = csv.field(colUtt);
    if (utt.isBlank()) throw new BadRows.RowProblem("utt_id is empty", "a non-empty utterance id");
    int rank = 0;
    if (colRank >= 0) rank = parseRank(csv.field(colRank));
    double[] features = new double[featureCols.length];
    for (int j = 0; j < featureCols.length; j++) features[j] = parseFeature(j, csv.field(featureCols[j]));
    String system = colSystem >= 0 ? csv.field(colSystem) : "";
    String group = colGroup >= 0 ? csv.field(colGroup) : "";
    return new Row(utt, system, rank, csv.field(colText), features, group, csv.line());
  }

  private static int parseRank(String value) throws BadRows.RowProblem {
    long v = Numbers.parseInt(value);
    if (v == Numbers.NOT_AN_INT) throw new BadRows.RowProblem("rank '" + shown(value) + "' is not a whole number", "an integer rank ≥ 1");
    if (v < 1) throw new BadRows.RowProblem("rank " + v + " is below 1", "an integer rank ≥ 1 (1 = the system's best)");
    return (int) v;
  }

  private double parseFeature(int j, String value) throws BadRows.RowProblem {
    FeatureSpec spec = options.features().get(j);
    String col = "score column '" + spec.name() + "'";
    if (value.isBlank()) throw new BadRows.RowProblem(col + " is blank", "a finite number in every row");
    double raw = Numbers.parseDecimal(value);
    if (Double.isNaN(raw)) throw new BadRows.RowProblem(col + " is '" + shown(value) + "'", "a finite decimal number such as -12.5 or 3e-4");
    if (Double.isInfinite(raw)) throw new BadRows.RowProblem(col + " is '" + shown(value) + "', which overflows", "a finite number");
    String rule = spec.rawProblem(raw);
    if (rule != null) throw new BadRows.RowProblem(col + " value '" + shown(value) + "' " + rule, "a value of 0 or more (0 counts as ln 1e-10)");
    double f = spec.toNaturalLog(raw);
    if (!Double.isFinite(f)) {
      throw new BadRows.RowProblem(col + " value '" + shown(value) + "' is out of range after conversion as " + spec,
          "a value that stays finite after scaling");
    }
    return f;
  }

  private void finish() {
    if (finished) return;
    finished = true;
    gaps.report(options.warnings());
    String primary = options.primarySystem();
    if (primary != null && !primarySeen) {
      options.warnings().accept(file + ": primary system '" + primary + "' does not occur"
          + (colSystem < 0 ? " (the file has no system column)" : "") + "; rank-1 ties went to file order");
    }
  }

  static String shown(String value) {
    return Messages.shown(value, SHOWN_VALUE_CHARS);
  }

  @Override
  public String toString() {
    return "HypothesesReader[" + file + "]";
  }

  /** Tallies utterances whose ranks (per system) are not exactly 1..n; one summary warning per file. */
  private static final class RankGaps {
    private final Path file;
    private long utterances;
    private String first;

    RankGaps(Path file) {
      this.file = file;
    }

    void check(List<Hypothesis> hyps) {
      Object2IntOpenHashMap<String> max = new Object2IntOpenHashMap<>();
      Object2IntOpenHashMap<String> count = new Object2IntOpenHashMap<>();
      for (Hypothesis h : hyps) {
        max.put(h.system(), Math.max(max.getInt(h.system()), h.rank()));
        count.addTo(h.system(), 1);
      }
      for (String s : max.keySet()) {
        if (max.getInt(s) != count.getInt(s)) {
          if (utterances++ == 0) first = describe(hyps, s);
          return;
        }
      }
    }

    private static String describe(List<Hypothesis> hyps, String system) {
      IntArrayList ranks = new IntArrayList();
      for (Hypothesis h : hyps) if (h.system().equals(system)) ranks.add(h.rank());
      ranks.sort(null);
      Hypothesis h0 = hyps.get(0);
      return "utterance '" + shown(h0.uttId()) + "' at line " + h0.line()
          + (system.isEmpty() ? "" : ", system '" + shown(system) + "'") + ", ranks " + ranks;
    }

    void report(java.util.function.Consumer<String> warnings) {
      if (utterances == 0) return;
      warnings.accept(file + ": ranks have gaps in " + utterances + " utterance" + (utterances == 1 ? "" : "s")
          + " (first: " + first + "); gaps are allowed, only the order of ranks matters");
    }
  }
}

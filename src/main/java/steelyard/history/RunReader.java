package steelyard.history;

import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.DateTimeException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.rescore.ModelIdentity;
import steelyard.text.Unit;

/**
 * The history's queries. A value the schema does not allow (an unknown unit or status, a command line that is
 * not a JSON array) is a {@link BadValue}, which {@link RunHistory} reports as a damaged file.
 */
final class RunReader {
  /** A stored value this version cannot read. */
  static final class BadValue extends RuntimeException {
    private static final long serialVersionUID = 1L;

    BadValue(String message, Throwable cause) {
      super(message, cause);
    }
  }

  private static final String SUMMARY_COLUMNS =
      "id, started_at, command, label, data_sha256, method, unit, utterances, reference_tokens, errors, ci95_low, ci95_high";

  /** Hex digits of a whole SHA-256: a filter this long matches exactly (and can use the index on data_sha256). */
  private static final int SHA256_HEX = 64;

  private RunReader() {}

  /** The runs {@code f} lets through, in id order. */
  static List<RunSummary> list(Connection c, RunFilter f, String orderBy) throws SQLException {
    StringBuilder sql = new StringBuilder("SELECT " + SUMMARY_COLUMNS + " FROM runs WHERE 1 = 1");
    List<String> args = new ArrayList<>();
    if (f.command() != null) condition(sql, args, " AND command = ?", f.command());
    if (f.method() != null) condition(sql, args, " AND method = ?", f.method());
    if (f.dataPrefix() != null && f.dataPrefix().length() == SHA256_HEX) condition(sql, args, " AND data_sha256 = ?", f.dataPrefix());
    else if (f.dataPrefix() != null) condition(sql, args, " AND substr(data_sha256, 1, length(?)) = ?", f.dataPrefix());
    if (f.text() != null)
      condition(sql, args, " AND (instr(lower(command_line), lower(?)) > 0 OR instr(lower(coalesce(label, '')), lower(?)) > 0"
          + " OR EXISTS (SELECT 1 FROM run_inputs i WHERE i.run_id = runs.id AND instr(lower(i.path), lower(?)) > 0))", f.text());
    sql.append(" ORDER BY ").append(orderBy);
    List<RunSummary> out = new ArrayList<>();
    try (PreparedStatement p = c.prepareStatement(sql.toString())) {
      for (int i = 0; i < args.size(); i++) p.setString(i + 1, args.get(i));
      try (ResultSet r = p.executeQuery()) {
        while (r.next()) out.add(summary(r));
      }
    }
    return out;
  }

  // Each condition binds its value once, as a numbered parameter ?N that the template may use several times.
  private static void condition(StringBuilder sql, List<String> args, String template, String value) {
    args.add(value);
    sql.append(template.replace("?", "?" + args.size()));
  }

  private static RunSummary summary(ResultSet r) throws SQLException {
    return new RunSummary(r.getLong(1), time(text(r, 2)), text(r, 3), text(r, 4), text(r, 5),
        text(r, 6), unit(text(r, 7)), r.getLong(8), r.getLong(9), r.getLong(10), interval(r, 11));
  }

  /** The run with this id, with its inputs and (when {@code rows}) its per-utterance rows; empty when there is none. */
  static Optional<StoredRun> get(Connection c, long id, boolean rows) throws SQLException {
    try (PreparedStatement p = c.prepareStatement("SELECT started_at, wall_ms, tool_version, command, command_line, label,"
        + " model_path, model_order, model_bytes, model_sha256, weights_json, method, unit, normalisation, missing_policy,"
        + " correct, substitutions, deletions, insertions, ci95_low, ci95_high, resamples, seed, warnings"
        + " FROM runs WHERE id = ?")) {
      p.setLong(1, id);
      try (ResultSet r = p.executeQuery()) {
        if (!r.next()) return Optional.empty();
        return Optional.of(new StoredRun(id, record(c, id, r, rows)));
      }
    }
  }

  private static RunRecord record(Connection c, long id, ResultSet r, boolean rows) throws SQLException {
    try {
      return new RunRecord(time(text(r, 1)), r.getLong(2), text(r, 3), text(r, 4), strings(text(r, 5)),
          text(r, 6), inputs(c, id), model(r, 7), text(r, 11), text(r, 12), unit(text(r, 13)), text(r, 14),
          policy(text(r, 15)), new EditCounts(r.getLong(16), r.getLong(17), r.getLong(18), r.getLong(19)), interval(r, 20),
          r.getInt(22), r.getLong(23), rows ? utterances(c, id) : UtteranceCounts.EMPTY, strings(text(r, 24)));
    } catch (IllegalArgumentException | NullPointerException e) {
      throw new BadValue("run " + id + ": " + e.getMessage(), e);
    }
  }

  /** The weights text of run {@code id}: empty when there is no such run, a null value inside when it has none. */
  static Optional<Optional<String>> weightsJson(Connection c, long id) throws SQLException {
    try (PreparedStatement p = c.prepareStatement("SELECT weights_json FROM runs WHERE id = ?")) {
      p.setLong(1, id);
      try (ResultSet r = p.executeQuery()) {
        return r.next() ? Optional.of(Optional.ofNullable(text(r, 1))) : Optional.empty();
      }
    }
  }

  private static List<InputFile> inputs(Connection c, long id) throws SQLException {
    List<InputFile> out = new ArrayList<>();
    try (PreparedStatement p = c.prepareStatement(
        "SELECT role, path, bytes, sha256, rows FROM run_inputs WHERE run_id = ? ORDER BY position")) {
      p.setLong(1, id);
      try (ResultSet r = p.executeQuery()) {
        while (r.next()) out.add(new InputFile(text(r, 1), text(r, 2), r.getLong(3), text(r, 4), r.getLong(5)));
      }
    }
    return out;
  }

  static UtteranceCounts utterances(Connection c, long id) throws SQLException {
    UtteranceCounts.Builder b = new UtteranceCounts.Builder(0);
    try (PreparedStatement p = c.prepareStatement(
        "SELECT utt_id, status, errors, reference_tokens FROM run_utterances WHERE run_id = ? ORDER BY position")) {
      p.setLong(1, id);
      try (ResultSet r = p.executeQuery()) {
        while (r.next()) b.add(text(r, 1), status(text(r, 2)), r.getInt(3), r.getInt(4));
      }
    }
    return b.build();
  }

  /**
   * A text column. Read as its UTF-8 bytes: sqlite-jdbc's {@code getString} costs about six times as much, which
   * dominates listing thousands of runs.
   */
  private static String text(ResultSet r, int column) throws SQLException {
    byte[] b = r.getBytes(column);
    return b == null ? null : new String(b, StandardCharsets.UTF_8);
  }

  private static List<String> strings(String json) {
    try {
      return HistoryJson.parseStrings(json);
    } catch (IllegalArgumentException e) {
      throw new BadValue(e.getMessage(), e);
    }
  }

  private static Instant time(String s) {
    try {
      return HistoryJson.parseTime(s);
    } catch (DateTimeException | NullPointerException e) {
      throw new BadValue("time '" + s + "' is not an ISO-8601 instant", e);
    }
  }

  private static ModelIdentity model(ResultSet r, int k) throws SQLException {
    String sha = text(r, k + 3);
    return sha == null ? null : new ModelIdentity(text(r, k), r.getInt(k + 1), r.getLong(k + 2), sha);
  }

  private static Bootstrap.Interval interval(ResultSet r, int k) throws SQLException {
    double low = r.getDouble(k);
    boolean noLow = r.wasNull();
    double high = r.getDouble(k + 1);
    boolean noHigh = r.wasNull();
    return new Bootstrap.Interval(noLow ? Double.NaN : low, noHigh ? Double.NaN : high);
  }

  private static Unit unit(String label) {
    switch (label) {
      case "word": return Unit.WORD;
      case "char": return Unit.CHAR;
      default: throw new BadValue("unknown unit '" + label + "'", null);
    }
  }

  private static MissingHypothesisPolicy policy(String label) {
    if (label == null) return null;
    MissingHypothesisPolicy p = MissingHypothesisPolicy.fromLabel(label);
    if (p == null) throw new BadValue("unknown missing-hypothesis policy '" + label + "'", null);
    return p;
  }

  private static UtteranceStatus status(String label) {
    UtteranceStatus s = UtteranceStatus.fromLabel(label);
    if (s == null) throw new BadValue("unknown utterance status '" + label + "'", null);
    return s;
  }
}

package steelyard.history;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Types;
import steelyard.report.ReportText;
import steelyard.rescore.ModelIdentity;

/** Inserts one run with its inputs and per-utterance rows in the caller's transaction. */
final class RunWriter {
  private static final String INSERT_RUN = "INSERT INTO runs (started_at, wall_ms, tool_version, command, command_line,"
      + " data_sha256, method, unit, normalisation, missing_policy, model_path, model_order, model_bytes, model_sha256,"
      + " weights_json, utterances, reference_tokens, correct, substitutions, deletions, insertions, errors, error_rate,"
      + " ci95_low, ci95_high, resamples, seed, warnings, label)"
      + " VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)";
  private static final String INSERT_INPUT =
      "INSERT INTO run_inputs (run_id, position, role, path, bytes, sha256, rows) VALUES (?, ?, ?, ?, ?, ?, ?)";
  private static final String INSERT_UTTERANCE =
      "INSERT INTO run_utterances (run_id, position, utt_id, status, errors, reference_tokens) VALUES (?, ?, ?, ?, ?, ?)";
  /** Rows per JDBC batch of per-utterance inserts. */
  private static final int BATCH = 4096;

  private RunWriter() {}

  /** Inserts {@code r} and returns its id. */
  static long insert(Connection c, RunRecord r) throws SQLException {
    long id = insertRun(c, r);
    insertInputs(c, id, r);
    insertUtterances(c, id, r.utterances());
    return id;
  }

  private static long insertRun(Connection c, RunRecord r) throws SQLException {
    try (PreparedStatement p = c.prepareStatement(INSERT_RUN)) {
      int k = 1;
      p.setString(k++, HistoryJson.time(r.startedAt()));
      p.setLong(k++, r.wallMillis());
      p.setString(k++, r.toolVersion());
      p.setString(k++, r.command());
      p.setString(k++, HistoryJson.strings(r.commandLine()));
      p.setString(k++, r.dataSha256());
      p.setString(k++, r.method());
      p.setString(k++, ReportText.unitLabel(r.unit()));
      p.setString(k++, r.normalisation());
      p.setString(k++, r.missingPolicy() == null ? null : r.missingPolicy().label());
      k = model(p, k, r.model());
      p.setString(k++, r.weightsJson());
      p.setLong(k++, r.utterances().includedCount());
      p.setLong(k++, r.totals().referenceTokens());
      p.setLong(k++, r.totals().correct());
      p.setLong(k++, r.totals().substitutions());
      p.setLong(k++, r.totals().deletions());
      p.setLong(k++, r.totals().insertions());
      p.setLong(k++, r.totals().errors());
      real(p, k++, r.errorRate());
      real(p, k++, r.ci95().low());
      real(p, k++, r.ci95().high());
      p.setInt(k++, r.resamples());
      p.setLong(k++, r.seed());
      p.setString(k++, HistoryJson.strings(r.warnings()));
      p.setString(k, r.label());
      p.executeUpdate();
    }
    try (PreparedStatement p = c.prepareStatement("SELECT last_insert_rowid()"); ResultSet rs = p.executeQuery()) {
      rs.next();
      return rs.getLong(1);
    }
  }

  private static int model(PreparedStatement p, int k, ModelIdentity m) throws SQLException {
    p.setString(k, m == null ? null : m.file());
    if (m == null) {
      p.setNull(k + 1, Types.INTEGER);
      p.setNull(k + 2, Types.INTEGER);
    } else {
      p.setInt(k + 1, m.order());
      p.setLong(k + 2, m.bytes());
    }
    p.setString(k + 3, m == null ? null : m.sha256());
    return k + 4;
  }

  // SQL has no NaN: an undefined rate or interval end is NULL.
  private static void real(PreparedStatement p, int k, double v) throws SQLException {
    if (Double.isFinite(v)) p.setDouble(k, v); else p.setNull(k, Types.REAL);
  }

  private static void insertInputs(Connection c, long id, RunRecord r) throws SQLException {
    try (PreparedStatement p = c.prepareStatement(INSERT_INPUT)) {
      int position = 0;
      for (InputFile f : r.inputs()) {
        p.setLong(1, id);
        p.setInt(2, position++);
        p.setString(3, f.role());
        p.setString(4, f.path());
        p.setLong(5, f.bytes());
        p.setString(6, f.sha256());
        p.setLong(7, f.rows());
        p.addBatch();
      }
      p.executeBatch();
    }
  }

  private static void insertUtterances(Connection c, long id, UtteranceCounts u) throws SQLException {
    try (PreparedStatement p = c.prepareStatement(INSERT_UTTERANCE)) {
      for (int row = 0; row < u.size(); row++) {
        p.setLong(1, id);
        p.setInt(2, row);
        p.setString(3, u.uttId(row));
        p.setString(4, u.status(row).label());
        p.setInt(5, u.errors(row));
        p.setInt(6, u.referenceTokens(row));
        p.addBatch();
        if ((row + 1) % BATCH == 0) p.executeBatch();
      }
      p.executeBatch();
    }
  }
}

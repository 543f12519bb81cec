package steelyard.history;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The history's tables and their versions. A history file is an SQLite database whose {@code PRAGMA
 * application_id} is {@value #APPLICATION_ID_HEX} and whose {@code PRAGMA user_version} is the schema version.
 *
 * <p>Upgrades: {@link #STEPS}{@code [k]} takes version k to k + 1; a step is never edited once released (a test
 * checks the checked-in version-1 file against step 0), only new steps are appended. {@link #upgrade} runs all
 * missing steps in one transaction, so a crash leaves the old version whole.
 *
 * <p>Version 1: {@code runs} (one row per run), {@code run_inputs} (its input files), {@code run_utterances} (its
 * per-utterance counts, in reference-file order). Version 2 adds {@code runs.label} (a compared system's name, or
 * {@code --system}), the index {@code runs_by_data} that serves one test set's error series over time and the
 * covering index {@code runs_list} that serves the run list.
 */
final class HistorySchema {
  /** "Stly" in ASCII: marks an SQLite file as a Steelyard run history. */
  static final int APPLICATION_ID = 0x53746C79;
  static final String APPLICATION_ID_HEX = "0x53746C79";
  /** The schema version this build writes. */
  static final int CURRENT = 2;

  private static final String[][] STEPS = {
    { // 0 → 1
      "CREATE TABLE runs ("
          + " id INTEGER PRIMARY KEY,"
          + " started_at TEXT NOT NULL,"        // UTC, uuuu-MM-ddTHH:mm:ss.SSSZ: sorts as text
          + " wall_ms INTEGER NOT NULL,"
          + " tool_version TEXT NOT NULL,"
          + " command TEXT NOT NULL,"
          + " command_line TEXT NOT NULL,"      // JSON array of the arguments
          + " data_sha256 TEXT,"                // SHA-256 of the references file
          + " method TEXT NOT NULL,"
          + " unit TEXT NOT NULL,"
          + " normalisation TEXT,"
          + " missing_policy TEXT,"
          + " model_path TEXT, model_order INTEGER, model_bytes INTEGER, model_sha256 TEXT,"
          + " weights_json TEXT,"
          + " utterances INTEGER NOT NULL,"     // included utterances
          + " reference_tokens INTEGER NOT NULL,"
          + " correct INTEGER NOT NULL, substitutions INTEGER NOT NULL, deletions INTEGER NOT NULL,"
          + " insertions INTEGER NOT NULL, errors INTEGER NOT NULL,"
          + " error_rate REAL,"                 // NULL when reference_tokens = 0
          + " ci95_low REAL, ci95_high REAL,"
          + " resamples INTEGER NOT NULL,"
          + " seed INTEGER NOT NULL,"
          + " warnings TEXT NOT NULL)",         // JSON array
      "CREATE TABLE run_inputs ("
          + " run_id INTEGER NOT NULL REFERENCES runs(id), position INTEGER NOT NULL, role TEXT NOT NULL,"
          + " path TEXT NOT NULL, bytes INTEGER NOT NULL, sha256 TEXT NOT NULL, rows INTEGER NOT NULL,"
          + " PRIMARY KEY (run_id, position)) WITHOUT ROWID",
      "CREATE TABLE run_utterances ("
          + " run_id INTEGER NOT NULL REFERENCES runs(id), position INTEGER NOT NULL, utt_id TEXT NOT NULL,"
          + " status TEXT NOT NULL, errors INTEGER NOT NULL, reference_tokens INTEGER NOT NULL,"
          + " PRIMARY KEY (run_id, position)) WITHOUT ROWID",
      "CREATE INDEX runs_by_command ON runs(command)",
    },
    { // 1 → 2
      "ALTER TABLE runs ADD COLUMN label TEXT",
      "CREATE INDEX runs_by_data ON runs(data_sha256, started_at)",
      // Covers the run list, so listing reads this narrow index instead of the rows with their weights and command lines.
      "CREATE INDEX runs_list ON runs(id, started_at, command, label, data_sha256, method, unit, utterances, reference_tokens,"
          + " errors, ci95_low, ci95_high)",
    },
  };

  /** Tables every version has; a history without one of them is damaged. */
  private static final List<String> TABLES = List.of("runs", "run_inputs", "run_utterances");

  private HistorySchema() {}

  /**
   * Reads (never writes) what the file is and returns its schema version: 0 for an empty database (a new file).
   * Throws an {@code InputException} for a database of another program, a newer schema, or missing tables.
   */
  static int check(Connection c, Path file) throws SQLException {
    // One statement, so one snapshot: another process may be creating the schema between separate reads.
    int appId;
    int version;
    List<String> tables = new ArrayList<>();
    try (Statement s = c.createStatement();
        ResultSet r = s.executeQuery("SELECT (SELECT application_id FROM pragma_application_id()),"
            + " (SELECT user_version FROM pragma_user_version()),"
            + " (SELECT group_concat(name, ',') FROM (SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name))")) {
      r.next();
      appId = r.getInt(1);
      version = r.getInt(2);
      String names = r.getString(3);
      if (names != null) tables.addAll(List.of(names.split(",")));
    }
    if (appId == 0 && version == 0 && tables.isEmpty()) return 0;
    if (appId != APPLICATION_ID) {
      String what = appId == 0 ? "tables " + String.join(", ", tables) : "application id " + hex(appId);
      throw SqlErrors.damaged(file, "is an SQLite database of another program (" + what + "), not a run history", null);
    }
    if (version > CURRENT)
      throw SqlErrors.damaged(file, "was written by a newer Steelyard (history schema version " + version
          + "); this version reads versions 1 to " + CURRENT + ", so the file was left as it is", null);
    if (version < 1) throw SqlErrors.damaged(file, "is marked as a run history but has no schema version", null);
    for (String t : TABLES)
      if (!tables.contains(t)) throw SqlErrors.damaged(file, "is a run history without its table '" + t + "'", null);
    return version;
  }

  /** Brings the schema to {@link #CURRENT} in one transaction, checking the file again under the write lock. */
  static void upgrade(Connection c, Path file) throws SQLException {
    boolean auto = c.getAutoCommit();
    c.setAutoCommit(false);
    try {
      int version = check(c, file);
      migrate(c, version, CURRENT);
      c.commit();
    } catch (SQLException | RuntimeException e) {
      c.rollback();
      throw e;
    } finally {
      c.setAutoCommit(auto);
    }
  }

  /** Runs the steps from version {@code from} up to {@code to} in the caller's transaction. */
  static void migrate(Connection c, int from, int to) throws SQLException {
    if (from >= to) return;
    try (Statement s = c.createStatement()) {
      for (int v = from; v < to; v++) for (String sql : STEPS[v]) s.execute(sql);
      s.execute("PRAGMA application_id = " + APPLICATION_ID);
      s.execute("PRAGMA user_version = " + to);
    }
  }

  static int pragma(Connection c, String name) throws SQLException {
    try (Statement s = c.createStatement(); ResultSet r = s.executeQuery("PRAGMA " + name)) {
      return r.next() ? r.getInt(1) : 0;
    }
  }

  private static String hex(int v) {
    return String.format(Locale.ROOT, "0x%08X", v);
  }
}

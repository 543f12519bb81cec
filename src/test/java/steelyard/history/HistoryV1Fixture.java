package steelyard.history;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.Statement;
import java.util.List;

/**
 * Writes {@code src/test/resources/history/history-v1.sqlite}: a run history as schema version 1 left it (step 0 of
 * {@link HistorySchema}, write-ahead logging, three runs inserted with version 1's columns). The checked-in file
 * was made once with
 *
 * <pre>
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.history.HistoryV1Fixture src/test/resources/history/history-v1.sqlite
 * </pre>
 *
 * and must never be regenerated with a later schema: {@code SchemaUpgradeTest} opens a copy, upgrades it and reads
 * these runs back. The runs are invented (Tallowmere cooperative voice logs); their values are listed here.
 */
final class HistoryV1Fixture {
  /** Per-utterance rows shared by the three runs: utt ids and reference tokens. */
  static final List<String> UTTERANCES = List.of("tpc-v-0001", "tpc-v-0002", "tpc-v-0003", "tpc-v-0004", "tpc-v-0005", "tpc-v-0006");
  static final int[] REFERENCE_TOKENS = {7, 5, 9, 4, 6, 8};
  /** Errors per utterance of runs 1, 2 and 3 (run 3 is on other references). */
  static final int[][] ERRORS = {{2, 0, 3, 1, 0, 2}, {1, 0, 1, 1, 0, 0}, {0, 1, 0, 0, 2, 1}};
  static final String REFS_SHA = "5f2c1a9e0b7d3c4e6a8f1b2d3e4c5a6b7c8d9e0f1a2b3c4d5e6f7a8b9c0d1e2f";
  static final String OTHER_REFS_SHA = "0a1b2c3d4e5f60718293a4b5c6d7e8f90a1b2c3d4e5f60718293a4b5c6d7e8f9";
  static final String WEIGHTS = "{\n  \"format\" : \"steelyard-weights\",\n  \"version\" : 1,\n  \"unit\" : \"word\",\n"
      + "  \"log_base\" : \"e\",\n  \"model\" : null,\n  \"methods\" : {\n    \"nbest\" : {\n      \"features\" : {\n"
      + "        \"acoustic\" : 1.0\n      },\n      \"lm_weight\" : 0.0,\n      \"length_weight\" : 2.5\n    }\n  }\n}\n";

  private HistoryV1Fixture() {}

  public static void main(String[] args) throws Exception {
    Path out = Path.of(args[0]);
    Files.deleteIfExists(out);
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + out)) {
      try (Statement s = c.createStatement()) {
        s.execute("PRAGMA journal_mode = WAL");
      }
      c.setAutoCommit(false);
      HistorySchema.migrate(c, 0, 1);
      run(c, 1, "2026-11-03T09:12:44.120Z", "first", REFS_SHA, null, ERRORS[0]);
      run(c, 2, "2026-11-17T14:05:02.503Z", "nbest", REFS_SHA, WEIGHTS, ERRORS[1]);
      run(c, 3, "2026-11-20T08:30:00.000Z", "first", OTHER_REFS_SHA, null, ERRORS[2]);
      c.commit();
    }
  }

  private static void run(Connection c, int id, String time, String method, String refsSha, String weights, int[] errors) throws Exception {
    int n = 0;
    int e = 0;
    for (int i = 0; i < errors.length; i++) {
      n += REFERENCE_TOKENS[i];
      e += errors[i];
    }
    try (PreparedStatement p = c.prepareStatement("INSERT INTO runs (id, started_at, wall_ms, tool_version, command, command_line,"
        + " data_sha256, method, unit, normalisation, missing_policy, weights_json, utterances, reference_tokens, correct,"
        + " substitutions, deletions, insertions, errors, error_rate, ci95_low, ci95_high, resamples, seed, warnings)"
        + " VALUES (?, ?, 1500, '0.1.0', ?, ?, ?, ?, 'word', 'nfkc fold-case', 'all-deletions', ?, 6, ?, ?, ?, 0, 0, ?, ?, NULL, NULL, 0, 20261202, '[]')")) {
      p.setInt(1, id);
      p.setString(2, time);
      p.setString(3, weights == null ? "score" : "rescore");
      p.setString(4, "[\"" + (weights == null ? "score" : "rescore") + "\",\"--hyps\",\"voice-" + id + ".csv\"]");
      p.setString(5, refsSha);
      p.setString(6, method);
      p.setString(7, weights);
      p.setInt(8, n);
      p.setInt(9, n - e);
      p.setInt(10, e);
      p.setInt(11, e);
      p.setDouble(12, (double) e / n);
      p.executeUpdate();
    }
    try (PreparedStatement p = c.prepareStatement("INSERT INTO run_inputs VALUES (?, ?, ?, ?, ?, ?, ?)")) {
      p.setInt(1, id);
      p.setInt(2, 0);
      p.setString(3, "references");
      p.setString(4, "voice-test.refs.csv");
      p.setLong(5, 512);
      p.setString(6, refsSha);
      p.setLong(7, 6);
      p.executeUpdate();
    }
    try (PreparedStatement p = c.prepareStatement("INSERT INTO run_utterances VALUES (?, ?, ?, 'scored', ?, ?)")) {
      for (int i = 0; i < errors.length; i++) {
        p.setInt(1, id);
        p.setInt(2, i);
        p.setString(3, UTTERANCES.get(i));
        p.setInt(4, errors[i]);
        p.setInt(5, REFERENCE_TOKENS[i]);
        p.executeUpdate();
      }
    }
  }
}

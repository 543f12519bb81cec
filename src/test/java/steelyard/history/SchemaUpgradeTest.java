package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static steelyard.history.HistoryFixtures.T0;
import static steelyard.history.HistoryFixtures.file;
import static steelyard.history.HistoryFixtures.rows;
import static steelyard.history.HistoryFixtures.scoreRun;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.eval.PairedComparison;
import steelyard.io.InputException;
import steelyard.report.CompareReport;
import steelyard.rescore.WeightsSpec;

/** The checked-in version-1 history ({@link HistoryV1Fixture}) opens, upgrades in place and keeps its runs. */
class SchemaUpgradeTest {
  private static final String V1 = "/history/history-v1.sqlite";

  @TempDir Path dir;

  private Path copyOfV1() throws IOException {
    Path db = dir.resolve("runs.db");
    try (InputStream in = SchemaUpgradeTest.class.getResourceAsStream(V1)) {
      assertThat(in).as("test resource " + V1).isNotNull();
      Files.copy(in, db);
    }
    return db;
  }

  private static List<String> schema(Path db) throws SQLException {
    List<String> out = new ArrayList<>();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db); Statement s = c.createStatement();
        ResultSet r = s.executeQuery("SELECT type || ' ' || name || ': ' || sql FROM sqlite_master ORDER BY name")) {
      while (r.next()) out.add(r.getString(1));
    }
    return out;
  }

  @Test
  void theCheckedInFileIsExactlyVersionOneOfTheSchemaSteps() throws Exception {
    // A released step must never change: the file made with step 0 has the same tables as step 0 makes today.
    Path v1 = copyOfV1();
    Path fresh = dir.resolve("fresh.db");
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + fresh)) {
      HistorySchema.migrate(c, 0, 1);
    }
    assertThat(schema(v1)).isEqualTo(schema(fresh)).isNotEmpty();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + v1)) {
      assertThat(HistorySchema.pragma(c, "user_version")).isEqualTo(1);
    }
  }

  @Test
  void aVersionOneHistoryUpgradesAndKeepsItsRuns() throws Exception {
    Path db = copyOfV1();
    try (RunHistory h = RunHistory.openExisting(db)) {
      assertThat(h.schemaVersion()).isEqualTo(HistorySchema.CURRENT);
      assertThat(h.list(RunFilter.ALL)).extracting(RunSummary::id).containsExactly(1L, 2L, 3L);
      for (int run = 0; run < 3; run++) {
        RunRecord r = h.get(run + 1).run();
        assertThat(r.label()).isNull();
        UtteranceCounts u = r.utterances();
        assertThat(u.size()).isEqualTo(HistoryV1Fixture.UTTERANCES.size());
        for (int i = 0; i < u.size(); i++) {
          assertThat(u.uttId(i)).isEqualTo(HistoryV1Fixture.UTTERANCES.get(i));
          assertThat(u.errors(i)).isEqualTo(HistoryV1Fixture.ERRORS[run][i]);
          assertThat(u.referenceTokens(i)).isEqualTo(HistoryV1Fixture.REFERENCE_TOKENS[i]);
        }
      }
      assertThat(h.get(2).run().weightsJson()).isEqualTo(HistoryV1Fixture.WEIGHTS);
      WeightsSpec w = h.weights(2);
      assertThat(w.lengthWeight).isEqualTo(2.5);
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db)) {
      assertThat(HistorySchema.pragma(c, "user_version")).isEqualTo(HistorySchema.CURRENT);
    }
  }

  @Test
  void upgradedRunsCompareAsTheirStoredCountsSay() throws Exception {
    try (RunHistory h = RunHistory.openExisting(copyOfV1())) {
      CompareReport.CompareRun c = h.compare(1, 2, null, 1000, 20261202L, 1);
      PairedComparison direct = PairedComparison.of(HistoryV1Fixture.ERRORS[0], HistoryV1Fixture.ERRORS[1],
          HistoryV1Fixture.REFERENCE_TOKENS, 1000, 20261202L, 1);
      assertThat(c.comparison()).isEqualTo(direct);
      assertThatThrownBy(() -> h.compare(1, 3, null, 1000, 1, 1)).isInstanceOf(InputException.class)
          .hasMessageContaining(HistoryV1Fixture.REFS_SHA).hasMessageContaining(HistoryV1Fixture.OTHER_REFS_SHA);
    }
  }

  @Test
  void anUpgradedHistoryTakesNewRunsWithLabels() throws Exception {
    Path db = copyOfV1();
    Path refs = file(dir, "refs.csv", "utt_id,text\n");
    try (RunHistory h = RunHistory.open(db)) {
      long id = h.record(scoreRun(refs, "first", rows(1, 4), T0).label("after upgrade").build());
      assertThat(id).isEqualTo(4);
      assertThat(h.list(new RunFilter(null, null, null, "after upgrade"))).extracting(RunSummary::label).containsExactly("after upgrade");
      assertThat(h.errorSeries(HistoryV1Fixture.REFS_SHA)).extracting(RunSummary::id).containsExactly(1L, 2L);
    }
  }
}

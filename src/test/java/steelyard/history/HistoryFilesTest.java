package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static steelyard.history.HistoryFixtures.T0;
import static steelyard.history.HistoryFixtures.file;
import static steelyard.history.HistoryFixtures.rows;
import static steelyard.history.HistoryFixtures.scoreRun;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.io.InputException;

/** What the history does with files it did not write, or cannot read: refuse with the path, never change them. */
class HistoryFilesTest {
  private static final long SEED = 20261202L;

  @TempDir Path dir;

  private static byte[] randomBytes(long seed, int n) {
    byte[] b = new byte[n];
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int i = 0; i < n; i++) b[i] = (byte) rnd.nextInt(256);
    return b;
  }

  /** Opening for recording and for reading both refuse; the file's bytes stay as they were. */
  private void assertRefusedUnchanged(Path db, String problem) throws IOException {
    byte[] before = Files.readAllBytes(db);
    assertThatThrownBy(() -> RunHistory.open(db)).isInstanceOf(InputException.class)
        .hasMessageStartingWith(db + ": ").hasMessageContaining(problem);
    assertThatThrownBy(() -> RunHistory.openExisting(db)).isInstanceOf(InputException.class).hasMessageContaining(problem);
    assertThat(Files.readAllBytes(db)).isEqualTo(before);
  }

  private static void sql(Path db, String... statements) throws SQLException {
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db); Statement s = c.createStatement()) {
      for (String q : statements) s.execute(q);
    }
  }

  @Test
  void randomBytesAreNotADatabase() throws IOException {
    Path db = dir.resolve("runs.db");
    Files.write(db, randomBytes(SEED, 8192));
    assertRefusedUnchanged(db, "is not an SQLite database");
  }

  @Test
  void aCsvFileIsNotADatabase() throws IOException {
    Path db = file(dir, "voice-test.refs.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay four\n");
    assertRefusedUnchanged(db, "is not an SQLite database");
  }

  @Test
  void anSqliteDatabaseOfAnotherProgramIsRefusedNamingItsTables() throws Exception {
    Path db = dir.resolve("pallets.db");
    sql(db, "CREATE TABLE pallets (id INTEGER PRIMARY KEY, bay TEXT)", "INSERT INTO pallets (bay) VALUES ('four')");
    assertRefusedUnchanged(db, "of another program (tables pallets)");
  }

  @Test
  void anSqliteDatabaseWithAnotherApplicationIdIsRefused() throws Exception {
    Path db = dir.resolve("other.db");
    sql(db, "PRAGMA application_id = 42", "CREATE TABLE runs (id INTEGER)");
    assertRefusedUnchanged(db, "application id 0x0000002A");
  }

  @Test
  void aNewerSchemaVersionIsRefusedAndLeftAlone() throws Exception {
    Path db = dir.resolve("runs.db");
    RunHistory.open(db).close();
    sql(db, "PRAGMA user_version = " + (HistorySchema.CURRENT + 1));
    assertRefusedUnchanged(db, "was written by a newer Steelyard (history schema version " + (HistorySchema.CURRENT + 1) + ")");
  }

  @Test
  void aHistoryMissingATableIsRefused() throws Exception {
    Path db = dir.resolve("runs.db");
    RunHistory.open(db).close();
    sql(db, "DROP TABLE run_inputs");
    assertRefusedUnchanged(db, "without its table 'run_inputs'");
  }

  @Test
  void damagedPagesAreReportedWithThePathWhenRead() throws Exception {
    Path db = dir.resolve("runs.db");
    Path refs = file(dir, "refs.csv", "utt_id,text\n");
    try (RunHistory h = RunHistory.open(db)) {
      for (int i = 0; i < 20; i++) h.record(scoreRun(refs, "first", rows(i, 200), T0).build());
    }
    // Keep page 1 (header and schema) and overwrite every later page with random bytes.
    long pageSize;
    try (RandomAccessFile f = new RandomAccessFile(db.toFile(), "rw")) {
      f.seek(16);
      pageSize = f.readUnsignedShort();
      f.seek(pageSize);
      f.write(randomBytes(SEED, (int) (f.length() - pageSize)));
    }
    byte[] before = Files.readAllBytes(db);
    assertThatThrownBy(() -> {
      try (RunHistory h = RunHistory.openExisting(db)) {
        h.list(RunFilter.ALL);
        h.get(1);
      }
    }).isInstanceOf(InputException.class).hasMessageStartingWith(db + ": ").hasMessageContaining("damaged");
    assertThat(Files.readAllBytes(db)).isEqualTo(before);
  }

  @Test
  void readingNeverCreatesAMissingHistory() {
    Path db = dir.resolve("nowhere.db");
    assertThatThrownBy(() -> RunHistory.openExisting(db)).isInstanceOf(InputException.class)
        .hasMessageStartingWith(db + ": no such run history");
    assertThat(db).doesNotExist();
  }

  @Test
  void aFolderIsNotAHistory() {
    assertThatThrownBy(() -> RunHistory.open(dir)).isInstanceOf(InputException.class).hasMessageContaining("is a folder");
  }

  @Test
  void aNewHistoryIsMarkedAsOursInWriteAheadLogMode() throws Exception {
    Path db = dir.resolve("runs.db");
    try (RunHistory h = RunHistory.open(db)) {
      assertThat(h.schemaVersion()).isEqualTo(HistorySchema.CURRENT);
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db)) {
      assertThat(HistorySchema.pragma(c, "application_id")).isEqualTo(HistorySchema.APPLICATION_ID);
      try (Statement s = c.createStatement(); var r = s.executeQuery("PRAGMA journal_mode")) {
        r.next();
        assertThat(r.getString(1)).isEqualTo("wal");
      }
    }
  }
}

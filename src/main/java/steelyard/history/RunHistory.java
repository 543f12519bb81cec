package steelyard.history;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteOpenMode;
import steelyard.io.InputException;
import steelyard.report.CompareReport;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;

/**
 * The run history: one SQLite file (xerial sqlite-jdbc) holding every recorded run, so runs can be listed,
 * inspected, their weights written back and any two on the same references compared months later.
 *
 * <pre>{@code
 * try (RunHistory h = RunHistory.openExisting(Path.of("runs.db"))) {
 *   for (RunSummary s : h.list(RunFilter.ALL)) System.out.println(s.id() + " " + s.errorRate());
 *   WeightsSpec w = h.weights(12);
 *   List<RunSummary> series = h.errorSeries(h.get(12).run().dataSha256());
 * }
 * }</pre>
 *
 * <p>Files: the database is in write-ahead-log mode (readers never block the writer; beside it SQLite keeps
 * {@code FILE-wal} and {@code FILE-shm}) with a busy timeout of {@value #BUSY_TIMEOUT_MS} ms, so several
 * processes may record into one file at once; each run is written in one {@code BEGIN IMMEDIATE} transaction, so
 * a run is stored whole or not at all. Opening checks what the file is before anything is written: a file that
 * is not SQLite, a damaged one, a database of another program or of a newer schema is refused with an
 * {@link InputException} naming the file, and never changed. An older schema is upgraded (see
 * {@link HistorySchema}).
 *
 * <p>Thread safety: one instance holds one connection; use it from one thread at a time.
 */
public final class RunHistory implements AutoCloseable {
  /** How long a write waits for another process's write to finish before giving up. */
  public static final int BUSY_TIMEOUT_MS = 30_000;

  private final Path file;
  private final Connection connection;

  private RunHistory(Path file, Connection connection) {
    this.file = file;
    this.connection = connection;
  }

  /** Opens the history at {@code file}, creating it when it does not exist (for recording). */
  public static RunHistory open(Path file) {
    return open(file, true);
  }

  /** Opens an existing history (for reading); a missing file is an {@link InputException}. */
  public static RunHistory openExisting(Path file) {
    return open(file, false);
  }

  private static RunHistory open(Path file, boolean create) {
    if (Files.isDirectory(file)) throw InputException.inFile(file, "is a folder", "a run history file");
    if (!create && !Files.exists(file))
      throw InputException.inFile(file, "no such run history", "a file written with --history or STEELYARD_HISTORY");
    Connection c = connect(file, create);
    try {
      int version = HistorySchema.check(c, file);
      if (version < HistorySchema.CURRENT) {
        walMode(c);
        HistorySchema.upgrade(c, file);
      }
      return new RunHistory(file, c);
    } catch (SQLException e) {
      closeQuietly(c);
      throw SqlErrors.map(file, e);
    } catch (RuntimeException e) {
      closeQuietly(c);
      throw e;
    }
  }

  private static Connection connect(Path file, boolean create) {
    SQLiteConfig config = new SQLiteConfig();
    config.setBusyTimeout(BUSY_TIMEOUT_MS);
    config.enforceForeignKeys(true);
    config.setTransactionMode(SQLiteConfig.TransactionMode.IMMEDIATE);
    config.resetOpenMode(SQLiteOpenMode.CREATE);
    if (create) config.setOpenMode(SQLiteOpenMode.CREATE);
    try {
      return config.createConnection("jdbc:sqlite:" + file);
    } catch (SQLException e) {
      throw SqlErrors.map(file, e);
    }
  }

  // Write-ahead logging is a property of the file: set once, when the schema is first written or upgraded.
  private static void walMode(Connection c) throws SQLException {
    try (Statement s = c.createStatement()) {
      s.execute("PRAGMA journal_mode = WAL");
    }
  }

  /** The history file. */
  public Path file() {
    return file;
  }

  /** The schema version of the open file (after any upgrade: {@link HistorySchema#CURRENT}). */
  public int schemaVersion() {
    return query(() -> HistorySchema.pragma(connection, "user_version"));
  }

  /** Stores one run (in one transaction) and returns its id. */
  public long record(RunRecord run) {
    return recordAll(List.of(run)).get(0);
  }

  /** Stores several runs of one command in one transaction (all or none) and returns their ids in order. */
  public List<Long> recordAll(List<RunRecord> runs) {
    return query(() -> {
      connection.setAutoCommit(false);
      try {
        List<Long> ids = new ArrayList<>(runs.size());
        for (RunRecord r : runs) ids.add(RunWriter.insert(connection, r));
        connection.commit();
        return ids;
      } catch (SQLException | RuntimeException e) {
        connection.rollback();
        throw e;
      } finally {
        connection.setAutoCommit(true);
      }
    });
  }

  /** The runs {@code filter} lets through, oldest id first. */
  public List<RunSummary> list(RunFilter filter) {
    return query(() -> RunReader.list(connection, filter, "id"));
  }

  /**
   * One test set's error across runs over time: every run scored on the references with this SHA-256, ordered by
   * start time (then id). For a chart of the error rate (with its interval) against {@link RunSummary#startedAt()}.
   */
  public List<RunSummary> errorSeries(String dataSha256) {
    return query(() -> RunReader.list(connection, RunFilter.data(dataSha256), "started_at, id"));
  }

  /** The run with this id, if there is one. */
  public Optional<StoredRun> find(long id) {
    return find(id, true);
  }

  /**
   * The run with this id, if there is one; without {@code withUtterances} its per-utterance rows are not read
   * ({@code run().utterances()} is then empty: use the {@link RunSummary} counts), which is much faster for big runs.
   */
  public Optional<StoredRun> find(long id, boolean withUtterances) {
    return query(() -> RunReader.get(connection, id, withUtterances));
  }

  /** The run with this id; an {@link InputException} naming the file when there is none. */
  public StoredRun get(long id) {
    return find(id).orElseThrow(() -> noSuchRun(id));
  }

  /** The weights of run {@code id} as a weights file's text; an {@link InputException} when it has none. */
  public String weightsJson(long id) {
    Optional<Optional<String>> w = query(() -> RunReader.weightsJson(connection, id));
    if (w.isEmpty()) throw noSuchRun(id);
    return w.get().orElseThrow(() -> InputException.inFile(file, "run " + id + " has no weights (it picked no transcripts by weight)",
        "the id of a rescore or tune run; see 'steelyard runs list'"));
  }

  /** The weights of run {@code id}, parsed as {@code rescore --weights} would read them. */
  public WeightsSpec weights(long id) {
    String json = weightsJson(id);
    try {
      return WeightsFile.read(Path.of(file + "#run-" + id), new StringReader(json), List.of());
    } catch (IOException e) {
      throw new IllegalStateException("reading a string cannot fail", e);
    }
  }

  /**
   * Compares two stored runs on the same references exactly as {@code compare} does on the files (paired
   * bootstrap, sign test; see {@link RunComparison}); render the result with {@link CompareReport}. Runs on
   * different references, in different units or normalised differently are an {@link InputException}.
   *
   * @param names     display names of A and B; null for the runs' labels when both have distinct ones, else {@code run ID}
   * @param resamples bootstrap resamples ({@code compare}'s default is 1000)
   * @param seed      bootstrap seed; the same seed as a {@code compare} run gives the same intervals
   * @param threads   worker threads; the result does not depend on them
   */
  public CompareReport.CompareRun compare(long idA, long idB, List<String> names, int resamples, long seed, int threads) {
    return RunComparison.compare(file, get(idA), get(idB), names, resamples, seed, threads);
  }

  @Override
  public void close() {
    try {
      connection.close();
    } catch (SQLException e) {
      throw SqlErrors.map(file, e);
    }
  }

  private InputException noSuchRun(long id) {
    return InputException.inFile(file, "has no run " + id, "an id that 'steelyard runs list' shows");
  }

  private interface Query<T> {
    T run() throws SQLException;
  }

  private <T> T query(Query<T> q) {
    try {
      return q.run();
    } catch (SQLException e) {
      throw SqlErrors.map(file, e);
    } catch (RunReader.BadValue e) {
      throw SqlErrors.damaged(file, "holds a value this version cannot read (" + e.getMessage() + ")", e);
    }
  }

  private static void closeQuietly(Connection c) {
    try {
      c.close();
    } catch (SQLException ignored) {
      // Already failing with a better message.
    }
  }
}

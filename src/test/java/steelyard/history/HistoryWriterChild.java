package steelyard.history;

import java.nio.file.Path;
import java.time.Clock;
import java.util.List;

/**
 * A process that records {@code COUNT} runs labelled {@code PREFIX-0} … into {@code HISTORY}, one recorder call (one
 * open, one transaction, one close) per run, as that many commands would:
 * {@code java -cp … steelyard.history.HistoryWriterChild HISTORY PREFIX COUNT REFS}. Exit code 0 only when every
 * run was recorded.
 */
public final class HistoryWriterChild {
  private HistoryWriterChild() {}

  public static void main(String[] args) {
    Path history = Path.of(args[0]);
    String prefix = args[1];
    int count = Integer.parseInt(args[2]);
    Path refs = Path.of(args[3]);
    Clock clock = Clock.systemUTC();
    int failed = 0;
    for (int i = 0; i < count; i++) {
      RunRecord.Builder run = HistoryFixtures.scoreRun(refs, "first", HistoryFixtures.rows(i, 50), clock.instant())
          .label(prefix + "-" + i).commandLine(List.of("score", "--label", prefix + "-" + i));
      if (HistoryRecording.record(history, System.err, run).size() != 1) failed++;
    }
    System.exit(failed == 0 ? 0 : 1);
  }
}

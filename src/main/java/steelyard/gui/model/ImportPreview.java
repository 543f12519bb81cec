package steelyard.gui.model;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.SkippedRow;

/**
 * The first lines of a hypotheses file as the import dialog shows them, each flagged with the import's own
 * message when its row is bad ({@code file:line: problem; expected …}, the words of the command line). The
 * rows are checked by the real reader in lenient mode with the chosen feature columns, so the preview
 * flags exactly what opening the file would reject.
 *
 * @param header       the header's column names (empty when the header itself is bad)
 * @param scoreColumns columns other than utt_id, text, system, rank and group: candidates for features
 * @param lines        the first lines of the file
 * @param fatal        a problem that stops the import as a whole (bad header, encoding, contiguity), or null
 * @param warnings     import warnings seen while checking the previewed rows
 */
public record ImportPreview(List<String> header, List<String> scoreColumns, List<Line> lines, String fatal, List<String> warnings) {
  private static final Set<String> RESERVED = Set.of("utt_id", "text", "system", "rank", "group");

  /** One physical line: its 1-based number, its text, and the message of the row starting there (or null). */
  public record Line(long number, String text, String problem) {}

  /** Whether any previewed row is bad or the file cannot be imported. */
  public boolean hasProblems() {
    return fatal != null || lines.stream().anyMatch(l -> l.problem() != null);
  }

  /** The preview of the first {@code maxLines} lines of {@code file}, rows checked with {@code features}. */
  public static ImportPreview of(Path file, List<FeatureSpec> features, int maxLines) {
    List<String> raw = new ArrayList<>();
    String fatal = null;
    try (BufferedReader r = InputFiles.open(file)) {
      for (String s; raw.size() < maxLines && (s = r.readLine()) != null; ) raw.add(s);
    } catch (InputException e) {
      fatal = e.getMessage();
    } catch (IOException e) {
      fatal = InputException.inFile(file, "cannot read (" + e.getMessage() + ")", "a readable file").getMessage();
    }
    Map<Long, String> problems = new HashMap<>();
    List<String> warnings = new ArrayList<>();
    List<String> header = List.of();
    if (fatal == null) {
      List<SkippedRow> skipped = new ArrayList<>();
      ImportOptions lenient = new ImportOptions(features, null, Integer.MAX_VALUE, warnings::add, skipped::add);
      try (HypothesesReader reader = HypothesesReader.open(file, lenient)) {
        header = reader.header();
        while (reader.hasNext() && reader.next().hypotheses().get(0).line() <= maxLines && skipped.size() < maxLines) {
          // read utterance by utterance until past the preview
        }
      } catch (InputException e) {
        fatal = e.getMessage();
      }
      for (SkippedRow s : skipped) problems.putIfAbsent(s.line(), s.file() + ":" + s.line() + ": " + s.reason());
    }
    List<Line> lines = new ArrayList<>(raw.size());
    for (int i = 0; i < raw.size(); i++) lines.add(new Line(i + 1, raw.get(i), problems.get(i + 1L)));
    List<String> scores = new ArrayList<>();
    for (String c : header) if (!RESERVED.contains(c)) scores.add(c);
    return new ImportPreview(List.copyOf(header), List.copyOf(scores), List.copyOf(lines), fatal, List.copyOf(warnings));
  }
}

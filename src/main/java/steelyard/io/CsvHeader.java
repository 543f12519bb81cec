package steelyard.io;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** The header row of a CSV input: column names (trimmed), unique and non-empty, looked up by name. */
final class CsvHeader {
  private final Path file;
  private final List<String> names;
  private final Map<String, Integer> index = new HashMap<>();
  private final String expectedColumns;
  private final long line;

  private CsvHeader(Path file, long line, List<String> names, String expectedColumns) {
    this.file = file;
    this.line = line;
    this.names = Collections.unmodifiableList(names);
    this.expectedColumns = expectedColumns;
  }

  /**
   * Reads and checks the first record as a header.
   *
   * @param expectedColumns shown in messages, e.g. {@code "a header row such as utt_id,text"}
   */
  static CsvHeader read(Path file, CsvRecordReader csv, String expectedColumns) {
    if (!csv.next()) throw InputException.inFile(file, "empty file", expectedColumns);
    if (csv.problem() != null) throw InputException.at(file, csv.line(), "header row: " + csv.problem(), csv.problemExpected());
    List<String> names = new ArrayList<>(csv.size());
    for (int i = 0; i < csv.size(); i++) names.add(csv.field(i).strip());
    CsvHeader h = new CsvHeader(file, csv.line(), names, expectedColumns);
    for (int i = 0; i < names.size(); i++) {
      String name = names.get(i);
      if (name.isEmpty()) {
        throw InputException.at(file, csv.line(), "header column " + (i + 1) + " has no name", "a name for every column");
      }
      Integer earlier = h.index.putIfAbsent(name, i);
      if (earlier != null) {
        throw InputException.at(file, csv.line(),
            "column '" + name + "' appears twice in the header (columns " + (earlier + 1) + " and " + (i + 1) + ")",
            "each column name once");
      }
    }
    return h;
  }

  List<String> names() {
    return names;
  }

  int width() {
    return names.size();
  }

  /** Index of a column that must exist. */
  int required(String name) {
    Integer i = index.get(name);
    if (i == null) {
      throw InputException.at(file, line, "header has no '" + name + "' column (found: " + found() + ")", expectedColumns);
    }
    return i;
  }

  /** Index of a feature column named in {@code --features}. */
  int feature(String name) {
    Integer i = index.get(name);
    if (i == null) {
      throw InputException.at(file, line, "no column '" + name + "' for --features (found: " + found() + ")",
          "--features to name columns of the header");
    }
    return i;
  }

  private String found() {
    return Messages.shown(String.join(",", names), 80);
  }

  /** Index of an optional column, or -1. */
  int optional(String name) {
    return index.getOrDefault(name, -1);
  }
}

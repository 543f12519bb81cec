package steelyard.io;

import java.nio.file.Path;
import java.util.LinkedHashMap;

/**
 * Reads a references CSV file ({@code utt_id,text[,group]}; header required; text may be empty) whole.
 * A duplicate {@code utt_id} or an empty one is an {@link InputException}.
 *
 * <p>Other columns are allowed and ignored. Row-level problems (wrong field count, stray quote, empty or
 * duplicate {@code utt_id}) go through the lenient-mode budget of {@link ImportOptions#maxBadRows()}; the
 * first of two rows with the same id is kept. Same input encodings as every reader ({@link InputFiles}).
 */
public final class ReferencesReader {
  static final String EXPECTED_HEADER = "a header row with columns utt_id,text and optionally group";

  private ReferencesReader() {}

  /** All references in file order, keyed by utterance id. */
  public static LinkedHashMap<String, Reference> readAll(Path file, ImportOptions options) {
    try (CsvRecordReader csv = new CsvRecordReader(file, InputFiles.openUnbuffered(file))) {
      CsvHeader header = CsvHeader.read(file, csv, EXPECTED_HEADER);
      int colUtt = header.required("utt_id");
      int colText = header.required("text");
      int colGroup = header.optional("group");
      boolean[] keep = new boolean[header.width()];
      keep[colUtt] = true;
      keep[colText] = true;
      if (colGroup >= 0) keep[colGroup] = true;
      csv.keepOnly(keep);
      BadRows bad = new BadRows(file, options);
      LinkedHashMap<String, Reference> out = new LinkedHashMap<>();
      while (csv.next()) {
        String problem = null;
        String expected = null;
        if (csv.problem() != null) {
          problem = csv.problem();
          expected = csv.problemExpected();
        } else if (csv.size() != header.width()) {
          problem = "row has " + csv.size() + " fields but the header has " + header.width();
          expected = header.width() + " comma-separated fields; put a field that contains a comma in double quotes";
        } else if (csv.field(colUtt).isBlank()) {
          problem = "utt_id is empty";
          expected = "a non-empty utterance id";
        } else {
          String id = csv.field(colUtt);
          Reference earlier = out.get(id);
          if (earlier == null) {
            String group = colGroup >= 0 ? csv.field(colGroup) : "";
            out.put(id, new Reference(id, csv.field(colText), group, csv.line()));
            continue;
          }
          problem = "utt_id '" + HypothesesReader.shown(id) + "' appears twice: first at line " + earlier.line() + ", again at line " + csv.line();
          expected = "one reference per utterance";
        }
        bad.reject(csv.line(), problem, expected);
      }
      return out;
    }
  }
}

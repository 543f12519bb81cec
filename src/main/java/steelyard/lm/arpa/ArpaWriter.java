package steelyard.lm.arpa;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.GZIPOutputStream;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelMetadata;

/**
 * Writes a {@link BackoffModel} as an ARPA file (gzip when the name ends in {@code .gz}), atomically.
 *
 * <p>Layout: the metadata lines (unit and normalisation first, see {@link ModelMetadata#linesFor}) as
 * {@code # key=value} comment lines, a blank line, {@code \data\} with the listed n-gram count per order,
 * then one section per order and {@code \end\}. Numbers are log10 with at most 7 significant digits
 * ({@code .} decimal point, trailing zeros dropped). Every n-gram below the highest order carries its back-off
 * field (also when it is 0); the highest order has none. N-grams appear in the model's entry order (the order
 * in which they were added to its builder), so the same model always gives the same bytes. Context-only
 * entries (prefixes that are not listed themselves) are not written; the longer n-grams that hang on them
 * are, which makes a valid pruned file that reads back to the same model.
 */
public final class ArpaWriter {
  private ArpaWriter() {}

  /** Writes {@code model} to {@code file}; a token containing whitespace cannot be written and is an {@link InputException}. */
  public static void write(BackoffModel model, Path file) {
    checkTokens(model, file);
    boolean gzip = file.getFileName().toString().endsWith(".gz");
    AtomicOutput.writeBytes(file, os -> {
      OutputStream target = gzip ? new GZIPOutputStream(os, 1 << 16) : os;
      Writer w = new OutputStreamWriter(target, StandardCharsets.UTF_8);
      write(model, w);
      w.flush();
      if (gzip) ((GZIPOutputStream) target).finish();
    });
  }

  /** Writes {@code model} as ARPA text to {@code file}, where {@code -} is {@code stdout} (see {@link AtomicOutput#writeText(Path, Writer, AtomicOutput.WriterBody)}). */
  public static void write(BackoffModel model, Path file, Writer stdout) {
    checkTokens(model, file);
    AtomicOutput.writeText(file, stdout, w -> write(model, w));
  }

  /** Writes the ARPA text of {@code model} to {@code w} (not closed, not flushed). */
  public static void write(BackoffModel model, Writer w) throws IOException {
    StringBuilder sb = new StringBuilder(256);
    List<String> meta = ModelMetadata.linesFor(model, model.metadata());
    for (String line : meta) w.write("# " + line.replace('\n', ' ').replace('\r', ' ') + "\n");
    w.write("\n\\data\\\n");
    int order = model.order();
    for (int k = 1; k <= order; k++) w.write("ngram " + k + "=" + model.ngramCount(k) + "\n");
    int[] ids = new int[order];
    for (int k = 1; k <= order; k++) {
      w.write("\n\\" + k + "-grams:\n");
      int entries = model.entryCount(k);
      for (int i = 0; i < entries; i++) {
        double p = model.log10Prob(k, i);
        if (Double.isNaN(p)) continue;
        sb.setLength(0);
        ArpaText.appendNumber(sb, p);
        model.ngram(k, i, ids);
        for (int j = 0; j < k; j++) sb.append(j == 0 ? '\t' : ' ').append(model.token(ids[j]));
        if (k < order) {
          sb.append('\t');
          ArpaText.appendNumber(sb, model.log10Backoff(k, i));
        }
        sb.append('\n');
        w.append(sb);
      }
    }
    w.write("\n\\end\\\n");
  }

  private static void checkTokens(BackoffModel model, Path file) {
    for (int id = 0; id < model.vocabularySize(); id++) {
      String t = model.token(id);
      boolean bad = t.isEmpty();
      for (int i = 0; i < t.length() && !bad; i++) bad = ArpaText.isSpace(t.charAt(i));
      if (bad) throw InputException.inFile(file, "token '" + t + "' is empty or contains whitespace and cannot be written as ARPA", "tokens without whitespace, or a .bin output");
    }
  }
}

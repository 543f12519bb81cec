package steelyard.lm.arpa;

import java.io.BufferedInputStream;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.zip.GZIPInputStream;
import java.util.zip.ZipException;
import steelyard.io.InputException;

/** Opens a model text file: gzip by the {@code .gz} name, strict UTF-8 (undecodable bytes are an error). */
public final class TextInput {
  private TextInput() {}

  public static BufferedReader open(Path file) {
    InputStream raw;
    if (Files.isDirectory(file)) throw InputException.inFile(file, "is a directory", "a model file");
    try {
      raw = new BufferedInputStream(Files.newInputStream(file), 1 << 16);
    } catch (NoSuchFileException e) {
      throw InputException.inFile(file, "no such file", "an existing model file").withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot open (" + e.getMessage() + ")", "a readable model file").withCause(e);
    }
    InputStream in = raw;
    if (file.getFileName().toString().endsWith(".gz")) {
      try {
        in = new GZIPInputStream(raw, 1 << 16);
      } catch (ZipException | java.io.EOFException e) {
        close(raw);
        throw InputException.inFile(file, "not gzip data although the name ends in .gz", "a gzip file, or a name without .gz").withCause(e);
      } catch (IOException e) {
        close(raw);
        throw InputException.inFile(file, "cannot read (" + e.getMessage() + ")", "a readable model file").withCause(e);
      }
    }
    return new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT)), 1 << 16);
  }

  private static void close(InputStream in) {
    try {
      in.close();
    } catch (IOException ignored) {
      // already failing with a better message
    }
  }
}

package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class InputFilesTest {
  @TempDir Path dir;

  private static String readAll(Path p) throws IOException {
    try (BufferedReader r = InputFiles.open(p)) {
      return r.lines().collect(Collectors.joining("|"));
    }
  }

  @Test
  void dropsLeadingBomAndAcceptsLfAndCrlf() throws IOException {
    Path p = Csv.write(dir, "a.txt", "\uFEFFone\r\ntwo\nthree");
    assertThat(readAll(p)).isEqualTo("one|two|three");
  }

  @Test
  void decodesMultiByteCharactersAcrossBufferBoundaries() throws IOException {
    String text = "Äpfel ✓ 🍎 ".repeat(20_000);
    assertThat(readAll(Csv.write(dir, "u.txt", text))).isEqualTo(text);
    assertThat(readAll(Csv.write(dir, "u.txt.gz", text))).isEqualTo(text);
  }

  @Test
  void invalidByteNamesLineAndColumn() {
    byte[] bytes = "ok\nab\u00e7d\n".getBytes(StandardCharsets.ISO_8859_1);
    Path p = Csv.writeBytes(dir, "latin.txt", bytes);
    assertThatThrownBy(() -> readAll(p))
        .isInstanceOf(InputException.class)
        .hasMessage(p + ":2:3: invalid UTF-8 byte sequence; expected UTF-8 text; convert the file to UTF-8 first");
  }

  @Test
  void invalidByteFarIntoALargeFileNamesItsLine() {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < 50_000; i++) sb.append("line ").append(i).append('\n');
    byte[] head = sb.toString().getBytes(StandardCharsets.UTF_8);
    byte[] all = new byte[head.length + 2];
    System.arraycopy(head, 0, all, 0, head.length);
    all[head.length] = 'x';
    all[head.length + 1] = (byte) 0xfe;
    Path p = Csv.writeBytes(dir, "big.txt", all);
    InputException e = org.assertj.core.api.Assertions.catchThrowableOfType(InputException.class, () -> readAll(p));
    assertThat(e.line()).isEqualTo(50_001);
    assertThat(e.column()).isEqualTo(2);
  }

  @Test
  void directoryIsAnInputError() {
    assertThatThrownBy(() -> InputFiles.open(dir)).isInstanceOf(InputException.class).hasMessage(dir + ": is a directory; expected a file");
  }

  @Test
  void gzipNameIsCaseInsensitive() {
    assertThat(InputFiles.isGzipName(Path.of("x.CSV.GZ"))).isTrue();
    assertThat(InputFiles.isGzipName(Path.of("x.csv"))).isFalse();
  }
}

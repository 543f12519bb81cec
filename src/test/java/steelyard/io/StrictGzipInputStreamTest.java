package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.SplittableRandom;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import java.util.zip.ZipException;
import org.junit.jupiter.api.Test;

/**
 * The strict gzip reader against the JDK's own {@link GZIPInputStream} (reference library) on valid data, and
 * against the format's rules (RFC 1952) where the JDK reader is lenient: bytes after the last member, a second
 * member cut short, a wrong CRC-32 or length.
 */
class StrictGzipInputStreamTest {
  private static byte[] text(long seed, int lines) {
    SplittableRandom rnd = new SplittableRandom(seed);
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < lines; i++) sb.append("bay-").append(i).append(",load ").append(rnd.nextInt(40)).append(" crates of pears\n");
    return sb.toString().getBytes(StandardCharsets.UTF_8);
  }

  private static byte[] gzip(byte[] plain) throws IOException {
    ByteArrayOutputStream bos = new ByteArrayOutputStream();
    try (GZIPOutputStream gz = new GZIPOutputStream(bos)) {
      gz.write(plain);
    }
    return bos.toByteArray();
  }

  private static byte[] concat(byte[]... parts) {
    ByteArrayOutputStream bos = new ByteArrayOutputStream();
    for (byte[] p : parts) bos.writeBytes(p);
    return bos.toByteArray();
  }

  private static byte[] strict(byte[] gz) throws IOException {
    try (InputStream in = new StrictGzipInputStream(new ByteArrayInputStream(gz))) {
      ByteArrayOutputStream out = new ByteArrayOutputStream();
      byte[] buf = new byte[777];
      for (int n; (n = in.read(buf, 0, buf.length)) >= 0; ) out.write(buf, 0, n);
      return out.toByteArray();
    }
  }

  private static byte[] jdk(byte[] gz) throws IOException {
    try (InputStream in = new GZIPInputStream(new ByteArrayInputStream(gz))) {
      return in.readAllBytes();
    }
  }

  @Test
  void readsSeveralMembersLikeTheJdkReader() throws IOException {
    byte[] a = text(1, 5000);
    byte[] b = text(2, 3);
    byte[] gz = concat(gzip(a), gzip(new byte[0]), gzip(b));
    assertThat(strict(gz)).isEqualTo(jdk(gz)).isEqualTo(concat(a, b));
  }

  @Test
  void trailingBytesAfterTheLastMemberAreAnErrorWhereTheJdkReaderDropsThem() throws IOException {
    byte[] gz = concat(gzip(text(3, 100)), "garbage".getBytes(StandardCharsets.UTF_8));
    assertThat(jdk(gz)).as("the JDK reader silently stops").isEqualTo(text(3, 100));
    assertThatThrownBy(() -> strict(gz)).isInstanceOf(ZipException.class).hasMessageContaining("after the end of the gzip stream");
  }

  @Test
  void aSecondMemberCutInItsFirstBytesIsTruncationWhereTheJdkReaderDropsIt() throws IOException {
    byte[] second = gzip(text(5, 30_000));
    for (int cut : new int[] {1, 2, 6, 10, 11, 40, second.length - 1}) {
      byte[] gz = concat(gzip(text(4, 10)), Arrays.copyOf(second, cut));
      assertThatThrownBy(() -> strict(gz)).as("second member cut at %d", cut).isInstanceOf(EOFException.class);
    }
    byte[] cutInHeader = concat(gzip(text(4, 10)), Arrays.copyOf(second, 6));
    assertThat(jdk(cutInHeader)).as("the JDK reader silently stops").isEqualTo(text(4, 10));
  }

  @Test
  void everyTruncationOfAValidFileFails() throws IOException {
    byte[] gz = concat(gzip(text(6, 50)), gzip(text(7, 50)));
    int first = gzip(text(6, 50)).length;
    for (int cut = 1; cut < gz.length; cut++) {
      byte[] part = Arrays.copyOf(gz, cut);
      if (cut == first) {
        assertThat(strict(part)).as("a cut at the member boundary is a complete file").isEqualTo(text(6, 50));
        continue;
      }
      int c = cut;
      assertThatThrownBy(() -> strict(part)).as("cut at %d of %d", c, gz.length).isInstanceOf(IOException.class);
    }
  }

  @Test
  void aWrongCrcOrLengthInTheTrailerIsAnError() throws IOException {
    byte[] gz = gzip(text(8, 20));
    byte[] badCrc = gz.clone();
    badCrc[gz.length - 8] ^= 1; // CRC-32, first of the last eight bytes (RFC 1952, section 2.3)
    assertThatThrownBy(() -> strict(badCrc)).isInstanceOf(ZipException.class).hasMessageContaining("CRC");
    byte[] badSize = gz.clone();
    badSize[gz.length - 4] ^= 1; // ISIZE
    assertThatThrownBy(() -> strict(badSize)).isInstanceOf(ZipException.class).hasMessageContaining("length");
  }

  /** A member with every optional header field (RFC 1952, section 2.3): FEXTRA, FNAME, FCOMMENT, FHCRC. */
  @Test
  void readsEveryOptionalHeaderField() throws IOException {
    byte[] plain = text(9, 40);
    ByteArrayOutputStream h = new ByteArrayOutputStream();
    h.writeBytes(new byte[] {0x1f, (byte) 0x8b, 8, 2 | 4 | 8 | 16, 0, 0, 0, 0, 0, 3});
    h.writeBytes(new byte[] {3, 0, 'a', 'b', 'c'});
    h.writeBytes("dock.csv\0".getBytes(StandardCharsets.ISO_8859_1));
    h.writeBytes("a comment\0".getBytes(StandardCharsets.ISO_8859_1));
    CRC32 headerCrc = new CRC32();
    headerCrc.update(h.toByteArray());
    h.write((int) headerCrc.getValue() & 0xff);
    h.write((int) (headerCrc.getValue() >> 8) & 0xff);
    Deflater d = new Deflater(Deflater.DEFAULT_COMPRESSION, true);
    d.setInput(plain);
    d.finish();
    byte[] buf = new byte[plain.length + 1024];
    int n = d.deflate(buf);
    d.end();
    h.write(buf, 0, n);
    CRC32 crc = new CRC32();
    crc.update(plain);
    for (long v : new long[] {crc.getValue(), plain.length}) for (int i = 0; i < 4; i++) h.write((int) (v >> (8 * i)) & 0xff);
    byte[] gz = h.toByteArray();
    assertThat(strict(gz)).isEqualTo(plain).isEqualTo(jdk(gz));
    gz[gz.length - 8 - n - 1] ^= 1; // the header CRC
    assertThatThrownBy(() -> strict(gz)).isInstanceOf(ZipException.class).hasMessageContaining("header checksum");
  }
}

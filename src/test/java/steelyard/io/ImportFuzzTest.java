package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded random and mutated inputs: the importers may accept a file or reject it with an
 * {@link InputException}, nothing else (invariant from the {@link InputException} contract).
 */
class ImportFuzzTest {
  @TempDir Path dir;

  private static final byte[] SEED_FILE = ("utt_id,system,rank,text,acoustic,lm\n"
      + "u1,fast,1,\"three crates, apples\",-120.5,-30.25\n"
      + "u1,fast,2,three crates of apple,-121.0,-31.5\n"
      + "u1,slow,1,\"say \"\"bay four\"\"\",-119,-33\n"
      + "u2,fast,1,pallet nine Äpfel ✓,-98.0,-22.0\r\n"
      + "u2,slow,3,,-99.5,-23.0\n").getBytes(StandardCharsets.UTF_8);

  private static final byte[] INTERESTING = ",\"\r\n\0 -.eE1+x".getBytes(StandardCharsets.US_ASCII);

  @Test
  void mutatedAndRandomBytesOnlyEverRaiseInputException() throws IOException {
    long seed = 20261202L;
    SplittableRandom rnd = new SplittableRandom(seed);
    Path hyps = dir.resolve("f.csv");
    int accepted = 0;
    for (int i = 0; i < 2000; i++) {
      byte[] bytes = i % 10 == 0 ? randomBytes(rnd) : mutate(SEED_FILE, rnd);
      Files.write(hyps, bytes);
      int maxBad = rnd.nextInt(3);
      try {
        ImportOptions o = new ImportOptions(FeatureSpec.parseList("acoustic,lm"), rnd.nextBoolean() ? "slow" : null, maxBad, w -> {}, s -> {});
        if (i % 2 == 0) Csv.readHyps(hyps, o);
        else ReferencesReader.readAll(hyps, o);
        accepted++;
      } catch (InputException expected) {
        assertThat(expected.getMessage()).as("seed %d case %d", seed, i).startsWith(hyps.toString());
      } catch (RuntimeException e) {
        throw new AssertionError("seed " + seed + " case " + i + ": unexpected " + e + " for bytes "
            + new String(bytes, StandardCharsets.ISO_8859_1), e);
      }
    }
    assertThat(accepted).as("seed %d: some mutants stay valid", seed).isPositive();
  }

  private static byte[] mutate(byte[] base, SplittableRandom rnd) {
    byte[] b = base.clone();
    int edits = 1 + rnd.nextInt(4);
    for (int e = 0; e < edits; e++) {
      int at = rnd.nextInt(b.length);
      switch (rnd.nextInt(4)) {
        case 0 -> b[at] = INTERESTING[rnd.nextInt(INTERESTING.length)];
        case 1 -> b[at] = (byte) rnd.nextInt(256);
        case 2 -> b = java.util.Arrays.copyOf(b, at + 1);
        default -> {
          byte[] c = new byte[b.length + 1];
          System.arraycopy(b, 0, c, 0, at);
          c[at] = INTERESTING[rnd.nextInt(INTERESTING.length)];
          System.arraycopy(b, at, c, at + 1, b.length - at);
          b = c;
        }
      }
    }
    return b;
  }

  private static byte[] randomBytes(SplittableRandom rnd) {
    byte[] b = new byte[rnd.nextInt(200)];
    for (int i = 0; i < b.length; i++) b[i] = rnd.nextBoolean() ? INTERESTING[rnd.nextInt(INTERESTING.length)] : (byte) rnd.nextInt(256);
    return b;
  }
}

package steelyard.io;

import java.nio.file.Path;

/** A separate process for the interrupted-write test: writes {@code args[1]} lines of text to {@code args[0]}. */
public final class AtomicOutputChild {
  private AtomicOutputChild() {}

  public static void main(String[] args) {
    int lines = Integer.parseInt(args[1]);
    AtomicOutput.writeText(Path.of(args[0]), out -> {
      for (int i = 0; i < lines; i++) out.write("new line " + i + " crates to bay " + (i % 9) + "\n");
    });
  }
}

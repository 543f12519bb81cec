package steelyard.io;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * All outputs of one command, written all or none: a failed run creates and changes no output file.
 *
 * <p>{@link #open} checks every output path before anything is written (no output is an input or another
 * output, every directory exists and takes a new file) and creates one empty temporary file beside each
 * regular-file target. While the set is open, {@link AtomicOutput} writes to those targets go into their
 * temporary files (forced to disk); {@link #commit} then moves all of them into place, one after another,
 * only after every output has been written. {@link #close} without a commit deletes the temporary files and
 * leaves every target as it was.
 *
 * <pre>{@code
 * try (OutputSet outputs = OutputSet.open(Map.of("--out", out, "--json", json), List.of(hyps, refs))) {
 *   AtomicOutput.writeText(out, w -> ...);   // staged, not yet visible
 *   JsonOutput.write(json, node);            // staged
 *   outputs.commit();                        // both moved into place
 * }
 * }</pre>
 *
 * <p>Limits: standard output and special files (devices, FIFOs, descriptors; see {@link OutputTarget}) are
 * streams and are written when the command writes them, not at the commit; what reached a pipe before a
 * failure cannot be taken back. A move can fail only when the directory changes during the run; the error then
 * says which targets were already replaced.
 *
 * <p>Sets are registered globally until they are committed or closed, so writes from any thread are staged;
 * the command line discards the sets a failed command left open ({@link #discardOpenedSince}). When sets nest
 * (a command that runs others, such as the demo), the earliest open set holding a path stages it, so the
 * outer command commits everything at its own end.
 */
public final class OutputSet implements AutoCloseable {
  private static final List<OutputSet> OPEN = new CopyOnWriteArrayList<>();

  /** A regular-file target: as given, its absolute form (links followed), its temporary file. */
  private static final class Entry {
    final Path target;
    final Path abs;
    Path tmp;
    boolean written;

    Entry(Path target, Path abs) {
      this.target = target;
      this.abs = abs;
    }
  }

  private final Map<Path, Entry> entries = new LinkedHashMap<>();
  private final Thread owner = Thread.currentThread();
  private final long serial;
  private boolean finished;
  private static long counter;

  private OutputSet() {
    synchronized (OPEN) {
      serial = ++counter;
    }
  }

  /**
   * Checks the outputs (keyed by option; null paths ignored) against each other and against {@code inputs}
   * (see {@link #refuseClashes}), then prepares a temporary file for every regular-file target. Any problem is
   * an {@link InputException} naming the option or the path, and nothing is left behind.
   */
  public static OutputSet open(Map<String, Path> outputsByOption, Collection<Path> inputs) {
    refuseClashes(outputsByOption, inputs);
    OutputSet set = new OutputSet();
    try {
      for (Map.Entry<String, Path> o : outputsByOption.entrySet()) if (o.getValue() != null) set.prepare(o.getValue());
    } catch (RuntimeException e) {
      set.discard();
      throw e;
    }
    OPEN.add(set);
    return set;
  }

  /**
   * Throws an {@link InputException} naming the option when an output path is an input path or another
   * output's path, or when more than one output is standard output ({@code -} or {@code /dev/stdout}). A
   * character device (such as {@code /dev/null}) may take several outputs and is never an input's file.
   */
  public static void refuseClashes(Map<String, Path> outputsByOption, Collection<Path> inputs) {
    List<Map.Entry<String, Path>> seen = new ArrayList<>();
    String stdoutTaken = null;
    for (Map.Entry<String, Path> out : outputsByOption.entrySet()) {
      Path p = out.getValue();
      if (p == null) continue;
      if (OutputTarget.kind(p) == OutputTarget.Kind.STDOUT) {
        if (stdoutTaken != null)
          throw InputException.option(out.getKey(), "standard output ('-') is already the output of " + stdoutTaken, "a file name");
        stdoutTaken = out.getKey();
        continue;
      }
      if (OutputTarget.isCharacterDevice(p)) continue;
      for (Path in : inputs) {
        if (in != null && same(p, in))
          throw InputException.option(out.getKey(), "output path is the input file " + in + " (also an input: writing would destroy it)",
              "an output path different from every input file");
      }
      for (Map.Entry<String, Path> other : seen) {
        if (same(p, other.getValue()))
          throw InputException.option(out.getKey(), "output " + p + " is also the output of " + other.getKey(), "a different output path");
      }
      seen.add(out);
    }
  }

  /** Moves every written output into place, in the order the options were given; unwritten ones stay untouched. */
  public void commit() {
    if (finished) throw new IllegalStateException("output set already finished");
    List<String> replaced = new ArrayList<>();
    try {
      for (Entry e : entries.values()) {
        if (!e.written) continue;
        AtomicOutput.copyPermissions(e.abs, e.tmp);
        try {
          AtomicOutput.moveIntoPlace(e.tmp, e.abs);
        } catch (IOException x) {
          String done = replaced.isEmpty() ? "no output was replaced" : "already replaced: " + String.join(", ", replaced);
          throw InputException.inFile(e.target, "cannot move the finished output into place (" + x + "); " + done,
              "a directory that stays writable while the command runs").withCause(x);
        }
        TempFiles.finished(e.tmp, true);
        e.tmp = null;
        replaced.add(e.target.toString());
      }
      for (Entry e : entries.values()) if (e.written) AtomicOutput.syncDirectory(e.abs.getParent());
    } finally {
      discard();
    }
  }

  /** Deletes the temporary files of a set that was not committed; the targets stay as they were. */
  @Override
  public void close() {
    discard();
  }

  /** A mark for {@link #discardOpenedSince}: every set opened later has a larger serial number. */
  public static long mark() {
    synchronized (OPEN) {
      return counter;
    }
  }

  /** Discards the sets the calling thread opened after {@code mark} and left open (a command that failed). */
  public static void discardOpenedSince(long mark) {
    for (OutputSet s : OPEN) if (s.owner == Thread.currentThread() && s.serial > mark) s.discard();
  }

  /** The open set that holds {@code target} as a regular-file output, or null. */
  static OutputSet holding(Path target) {
    if (OPEN.isEmpty()) return null;
    Path key = target.toAbsolutePath().normalize();
    for (OutputSet s : OPEN) if (!s.finished && s.entries.containsKey(key)) return s;
    return null;
  }

  /** Writes {@code body} into the temporary file of {@code target}; visible at {@link #commit}. */
  void stage(Path target, AtomicOutput.StreamBody body) {
    Entry e = entries.get(target.toAbsolutePath().normalize());
    try {
      AtomicOutput.writeTemporary(e.tmp, body);
      e.written = true;
    } catch (IOException x) {
      throw AtomicOutput.cannotWrite(target, x);
    }
  }

  private void prepare(Path target) {
    OutputTarget.Kind kind = OutputTarget.kind(target);
    if (kind == OutputTarget.Kind.STDOUT || kind == OutputTarget.Kind.STDERR) return;
    if (kind == OutputTarget.Kind.IN_PLACE) {
      if (!Files.exists(target))
        throw InputException.inFile(target, "no such file or descriptor", "an open descriptor, an existing device or FIFO, or a regular file path");
      if (!Files.isWritable(target)) throw InputException.inFile(target, "permission denied", "a writable output");
      return;
    }
    Entry e = new Entry(target, AtomicOutput.checkedTarget(target));
    TempFiles.cleanLeftovers(e.abs);
    entries.put(target.toAbsolutePath().normalize(), e);
    e.tmp = TempFiles.create(target, e.abs);
  }

  private void discard() {
    if (finished) return;
    finished = true;
    OPEN.remove(this);
    for (Entry e : entries.values()) if (e.tmp != null) TempFiles.finished(e.tmp, false);
  }

  private static boolean same(Path a, Path b) {
    if (a.toAbsolutePath().normalize().equals(b.toAbsolutePath().normalize())) return true;
    try {
      return Files.exists(a) && Files.exists(b) && Files.isSameFile(a, b);
    } catch (IOException e) {
      return false;
    }
  }
}

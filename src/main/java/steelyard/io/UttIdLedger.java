package steelyard.io;

/**
 * Remembers which utterance ids a streaming reader has already finished, to detect an id that reappears
 * after other utterances, without keeping the id strings.
 *
 * <p>Storage: open addressing over three parallel primitive arrays holding a 128-bit fingerprint of the id
 * (two independent 64-bit hashes) and the 1-based line where the id was first seen: 24 bytes per slot,
 * load between 0.375 and 0.75, so 32 to 64 bytes per utterance whatever the id length (a million
 * utterances: 32–64 MB).
 * Capacity limit 2^30 slots. Two different ids sharing a 128-bit fingerprint would be wrongly reported as a
 * repeat; for n ids that has probability about n²/2^129 (≈ 10^-21 for a billion ids).
 */
final class UttIdLedger {
  private long[] hashA = new long[1024];
  private long[] hashB = new long[1024];
  private long[] lines = new long[1024];
  private int size;

  /** Records {@code id} first seen at {@code line}; returns that earlier line if it was known, else 0. */
  long addIfAbsent(String id, long line) {
    long a = hashA(id);
    long b = hashB(id);
    if (a == 0 && b == 0) a = 1; // (0,0) marks an empty slot
    int mask = hashA.length - 1;
    int slot = (int) (a ^ (a >>> 32)) & mask;
    while (hashA[slot] != 0 || hashB[slot] != 0) {
      if (hashA[slot] == a && hashB[slot] == b) return lines[slot];
      slot = (slot + 1) & mask;
    }
    hashA[slot] = a;
    hashB[slot] = b;
    lines[slot] = line;
    if (++size * 4L > hashA.length * 3L) grow();
    return 0;
  }

  private void grow() {
    long[] oldA = hashA;
    long[] oldB = hashB;
    long[] oldL = lines;
    int n = oldA.length * 2;
    if (n <= 0 || n > 1 << 30) throw new IllegalStateException("too many utterances for the id ledger");
    hashA = new long[n];
    hashB = new long[n];
    lines = new long[n];
    int mask = n - 1;
    for (int i = 0; i < oldA.length; i++) {
      if (oldA[i] == 0 && oldB[i] == 0) continue;
      int slot = (int) (oldA[i] ^ (oldA[i] >>> 32)) & mask;
      while (hashA[slot] != 0 || hashB[slot] != 0) slot = (slot + 1) & mask;
      hashA[slot] = oldA[i];
      hashB[slot] = oldB[i];
      lines[slot] = oldL[i];
    }
  }

  /** 64-bit FNV-1a over UTF-16 units, finalised with a murmur3 mix. */
  private static long hashA(String s) {
    long h = 0xcbf29ce484222325L;
    for (int i = 0; i < s.length(); i++) {
      h ^= s.charAt(i);
      h *= 0x100000001b3L;
    }
    return mix(h ^ s.length());
  }

  /** A different multiplicative hash (golden-ratio constant), also murmur3-mixed. */
  private static long hashB(String s) {
    long h = 0x9E3779B97F4A7C15L;
    for (int i = 0; i < s.length(); i++) {
      h = (h + s.charAt(i)) * 0xC2B2AE3D27D4EB4FL;
      h ^= h >>> 29;
    }
    return mix(h + s.length());
  }

  private static long mix(long z) {
    z = (z ^ (z >>> 33)) * 0xff51afd7ed558ccdL;
    z = (z ^ (z >>> 33)) * 0xc4ceb9fe1a85ec53L;
    return z ^ (z >>> 33);
  }
}

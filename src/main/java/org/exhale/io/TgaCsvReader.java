package org.exhale.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import org.exhale.PhysicalConstants;
import org.exhale.fitting.TgaRun;

/**
 * Reads thermogravimetric runs from CSV exports.
 *
 * <p>Accepted layout: optional leading lines starting with {@code #}, a header row, then data
 * rows. The separator is a tab, a semicolon or a comma (tab, then semicolon, is preferred when
 * present in the header). With tab or semicolon separators a decimal comma is accepted. The header
 * names each quantity and its unit, in spellings such as {@code time_min}, {@code Time (min)},
 * {@code t [s]}, {@code temperature_C}, {@code Temp [°C]}, {@code Sample temperature/K},
 * {@code mass_mg}, {@code Mass/%}, {@code weight_mg}, {@code TG (%)}. An optional {@code run}
 * column splits one file into several runs. Columns that are not recognised are ignored; every
 * choice is reported in {@link Result#notes()}.
 *
 * <p>Plain parsing rather than tablesaw: tablesaw's CSV reader guesses column types and reads
 * decimal commas only through a locale, and its errors do not name the row and column the way
 * {@link InputException} must; it also costs ~0.4 s on first use, a sizeable part of the fit's
 * time budget. A file larger than the size cap (100 MB by default) is refused before it is read.
 */
public final class TgaCsvReader {
    public static final long DEFAULT_MAX_BYTES = 100L * 1024 * 1024;
    private static final Pattern NUMBER = Pattern.compile("[+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?");

    private final long maxBytes;
    private final String temperatureColumn;
    private final String segment;

    /** What was read: the runs, one line per decision taken, and each run's metadata block. */
    public record Result(List<TgaRun> runs, List<String> notes, Map<String, Map<String, String>> metadata) {
        public Result {
            runs = List.copyOf(runs);
            notes = List.copyOf(notes);
            metadata = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
        }

        public Result(List<TgaRun> runs, List<String> notes) {
            this(runs, notes, Map.of());
        }
    }

    private enum Quantity { TIME, TEMPERATURE, MASS, RUN }

    private record Column(int index, String header, Quantity quantity, String unit, double scale, double offset) {
    }

    public TgaCsvReader() {
        this(DEFAULT_MAX_BYTES);
    }

    public TgaCsvReader(long maxBytes) {
        this(maxBytes, null, null);
    }

    private TgaCsvReader(long maxBytes, String temperatureColumn, String segment) {
        if (maxBytes <= 0) {
            throw new IllegalArgumentException("size cap must be positive, got " + maxBytes);
        }
        this.maxBytes = maxBytes;
        this.temperatureColumn = temperatureColumn;
        this.segment = segment;
    }

    /** A reader that takes the sample temperature from this column (header text or number from 1); null: choose. */
    public TgaCsvReader withTemperatureColumn(String column) {
        return new TgaCsvReader(maxBytes, column, segment);
    }

    /** A reader that keeps only this segment (block number or segment-column value); null: all heating segments. */
    public TgaCsvReader withSegment(String s) {
        return new TgaCsvReader(maxBytes, temperatureColumn, s);
    }

    public Result read(Path file) {
        String name = file.toString();
        long size;
        try {
            size = Files.size(file);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, name, "", 0,
                    "cannot read the file (" + e.getMessage() + "); expected a readable CSV file", e);
        }
        if (size > maxBytes) {
            throw new InputException(ErrorKind.TOO_LARGE, name, "", 0, "file is " + size / (1024 * 1024)
                    + " MB, larger than the " + maxBytes / (1024 * 1024) + " MB cap; split it or subsample it");
        }
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (IOException e) {
            throw new InputException(ErrorKind.FILE_UNREADABLE, name, "", 0,
                    "cannot read the file (" + e.getMessage() + ")", e);
        }
        return read(name, decode(bytes));
    }

    /** UTF-8, or Latin-1 where the bytes are not valid UTF-8 (older instrument exports). */
    private static String decode(byte[] bytes) {
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            return new String(bytes, StandardCharsets.ISO_8859_1);
        }
    }

    /** Reads CSV text; {@code fileName} is used in messages and run labels. */
    public Result read(String fileName, String content) {
        if (content.length() > maxBytes) {
            throw new InputException(ErrorKind.TOO_LARGE, fileName, "", 0, "content is larger than the "
                    + maxBytes / (1024 * 1024) + " MB cap");
        }
        if (content.indexOf('\0') >= 0) {
            throw new InputException(ErrorKind.SYNTAX, fileName, "", 0,
                    "not a text file (contains NUL bytes); expected a CSV export of a thermogravimetric run");
        }
        if (content.startsWith("\uFEFF")) {
            content = content.substring(1);
        }
        String[] lines = content.split("\r\n|\n|\r", -1);
        int h = 0;
        while (h < lines.length && (lines[h].isBlank() || lines[h].trim().startsWith("#"))) {
            h++;
        }
        if (h >= lines.length) {
            throw new InputException(ErrorKind.EMPTY_FILE, fileName, "", 0,
                    "no header row; expected a header such as 'time_min,temperature_C,mass_mg'");
        }
        String header = lines[h];
        char sep = header.indexOf('\t') >= 0 ? '\t' : header.indexOf(';') >= 0 ? ';' : ',';
        boolean commaDecimalAllowed = sep != ',';
        String[] names = split(header, sep);
        List<String> notes = new ArrayList<>();
        notes.add(fileName + ": separator " + (sep == '\t' ? "tab" : "'" + sep + "'")
                + (commaDecimalAllowed ? ", decimal point or comma" : ", decimal point"));
        Map<Quantity, Column> columns = classify(fileName, h + 1, names, notes);
        for (Quantity q : List.of(Quantity.TIME, Quantity.TEMPERATURE, Quantity.MASS)) {
            if (!columns.containsKey(q)) {
                throw new InputException(ErrorKind.MISSING_KEY, fileName, "header", h + 1, "no "
                        + q.name().toLowerCase(Locale.ROOT) + " column among " + String.join(" | ", names)
                        + "; expected e.g. " + example(q));
            }
        }
        Column ct = columns.get(Quantity.TIME), cT = columns.get(Quantity.TEMPERATURE), cm = columns.get(Quantity.MASS);
        Column cr = columns.get(Quantity.RUN);
        int needed = Math.max(Math.max(ct.index, cT.index), Math.max(cm.index, cr == null ? 0 : cr.index)) + 1;

        Map<String, Series> runs = new LinkedHashMap<>();
        for (int li = h + 1; li < lines.length; li++) {
            String line = lines[li];
            if (line.isBlank() || line.trim().startsWith("#")) {
                continue;
            }
            String[] cells = split(line, sep);
            int row = li + 1;
            if (cells.length < needed) {
                throw new InputException(ErrorKind.SYNTAX, fileName, "row " + row, row, "has " + cells.length
                        + " fields, expected at least " + needed + " (separator "
                        + (sep == '\t' ? "tab" : "'" + sep + "'") + ")");
            }
            String key = cr == null ? "" : cells[cr.index].trim();
            Series s = runs.computeIfAbsent(key, k -> new Series());
            double t = number(fileName, row, ct, cells[ct.index], commaDecimalAllowed) * ct.scale + ct.offset;
            double temp = number(fileName, row, cT, cells[cT.index], commaDecimalAllowed) * cT.scale + cT.offset;
            double m = number(fileName, row, cm, cells[cm.index], commaDecimalAllowed) * cm.scale;
            if (!(temp > 0)) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, fileName, where(row, cT), row, "temperature "
                        + cells[cT.index].trim() + " " + cT.unit + " is at or below absolute zero");
            }
            if (s.size > 0 && !(t > s.time[s.size - 1])) {
                throw new InputException(ErrorKind.INCONSISTENT, fileName, where(row, ct), row, "time "
                        + cells[ct.index].trim() + " " + ct.unit + " does not increase (previous row "
                        + s.row[s.size - 1] + "); expected strictly increasing time within a run");
            }
            s.add(t, temp, m, row);
        }
        if (runs.isEmpty()) {
            throw new InputException(ErrorKind.EMPTY_FILE, fileName, "", h + 1, "header but no data rows");
        }
        String stem = stem(fileName);
        List<TgaRun> out = new ArrayList<>();
        for (Map.Entry<String, Series> e : runs.entrySet()) {
            Series s = e.getValue();
            String label = e.getKey().isEmpty() ? stem : stem + ":" + e.getKey();
            if (s.size < TgaRun.MIN_POINTS) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, fileName, cr == null ? "" : "run " + e.getKey(),
                        s.size == 0 ? 0 : s.row[s.size - 1], s.size + " data rows, at least " + TgaRun.MIN_POINTS
                        + " needed for a run");
            }
            out.add(new TgaRun(label, java.util.Arrays.copyOf(s.time, s.size), java.util.Arrays.copyOf(s.temp, s.size),
                    java.util.Arrays.copyOf(s.mass, s.size),
                    cm.unit.equals("%") ? TgaRun.MassBasis.FRACTION : TgaRun.MassBasis.KILOGRAM));
        }
        if (cr != null) {
            notes.add(fileName + ": " + out.size() + " runs by column '" + cr.header + "'");
        }
        return new Result(out, notes);
    }

    private static final class Series {
        double[] time = new double[1024];
        double[] temp = new double[1024];
        double[] mass = new double[1024];
        int[] row = new int[1024];
        int size;

        void add(double t, double tk, double m, int r) {
            if (size == time.length) {
                int n = size * 2;
                time = java.util.Arrays.copyOf(time, n);
                temp = java.util.Arrays.copyOf(temp, n);
                mass = java.util.Arrays.copyOf(mass, n);
                row = java.util.Arrays.copyOf(row, n);
            }
            time[size] = t;
            temp[size] = tk;
            mass[size] = m;
            row[size] = r;
            size++;
        }
    }

    private static String[] split(String line, char sep) {
        String[] parts = line.split(Pattern.quote(String.valueOf(sep)), -1);
        for (int i = 0; i < parts.length; i++) {
            String p = parts[i].trim();
            if (p.length() >= 2 && p.startsWith("\"") && p.endsWith("\"")) {
                p = p.substring(1, p.length() - 1).trim();
            }
            parts[i] = p;
        }
        return parts;
    }

    private static double number(String file, int row, Column c, String cell, boolean commaDecimal) {
        String s = cell.trim();
        if (commaDecimal) {
            s = s.replace(',', '.');
        }
        if (!NUMBER.matcher(s).matches()) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, where(row, c), row, "'" + cell.trim()
                    + "' is not a number; expected a finite decimal number"
                    + (commaDecimal ? " (point or comma)" : " with a decimal point"));
        }
        double v = Double.parseDouble(s);
        if (!Double.isFinite(v)) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, where(row, c), row, "'" + cell.trim() + "' is too large");
        }
        return v;
    }

    private static String where(int row, Column c) {
        return "row " + row + ", column " + (c.index + 1) + " '" + c.header + "'";
    }

    private static String example(Quantity q) {
        return switch (q) {
            case TIME -> "'time_min', 'time_s' or 'Time (min)'";
            case TEMPERATURE -> "'temperature_C', 'temperature_K' or 'Temp [°C]'";
            case MASS -> "'mass_mg', 'mass_pct' or 'Mass/%'";
            case RUN -> "'run'";
        };
    }

    private static Map<Quantity, Column> classify(String file, int line, String[] names, List<String> notes) {
        Map<Quantity, Column> found = new LinkedHashMap<>();
        for (int i = 0; i < names.length; i++) {
            String raw = names[i];
            String n = raw.toLowerCase(Locale.ROOT).trim();
            Quantity q;
            String rest;
            String[] words = n.split("[\\s_()\\[\\]/,:{}-]+");
            String first = words.length == 0 ? "" : words[0];
            boolean sample = n.contains("sample");
            if (sample && words.length > 1) {
                first = words[1];
                n = n.substring(n.indexOf(first));
            }
            if (n.contains("deriv") || n.contains("rate") || n.contains("dtg") || n.contains("/dt")) {
                notes.add(file + ": column " + (i + 1) + " '" + raw + "' looks like a rate, ignored");
                continue;
            }
            if (n.equals("run") || n.equals("run_id") || n.equals("run id") || n.equals("run no")) {
                found.putIfAbsent(Quantity.RUN, new Column(i, raw, Quantity.RUN, "", 1, 0));
                continue;
            }
            if (first.equals("time") || first.equals("t")) {
                q = Quantity.TIME;
            } else if (first.startsWith("temp")) {
                q = Quantity.TEMPERATURE;
            } else if (first.equals("mass") || first.equals("weight") || first.equals("wt") || first.equals("tg")
                    || first.equals("tga")) {
                q = Quantity.MASS;
            } else {
                notes.add(file + ": column " + (i + 1) + " '" + raw + "' not recognised, ignored");
                continue;
            }
            rest = n.substring(n.indexOf(first) + first.length());
            if (q == Quantity.MASS && rest.startsWith("%")) {
                rest = " " + rest;
            }
            String unit = rest.replaceAll("^[\\s_()\\[\\]/,:{}-]+", "").replaceAll("[\\s()\\[\\]{}]+$", "")
                    .replace("℃", "°c").trim();
            Column c = unitColumn(file, line, i, raw, q, unit);
            if (c == null) {
                continue;
            }
            Column prev = found.get(q);
            if (prev == null || (q == Quantity.TEMPERATURE && sample && !prev.header.toLowerCase(Locale.ROOT).contains("sample"))) {
                if (prev != null) {
                    notes.add(file + ": column " + (prev.index + 1) + " '" + prev.header + "' ignored in favour of the sample temperature");
                }
                found.put(q, c);
            } else {
                notes.add(file + ": column " + (i + 1) + " '" + raw + "' ignored, " + q.name().toLowerCase(Locale.ROOT)
                        + " already taken from column " + (prev.index + 1));
            }
        }
        for (Column c : found.values()) {
            if (c.quantity != Quantity.RUN) {
                notes.add(file + ": column " + (c.index + 1) + " '" + c.header + "' taken as "
                        + c.quantity.name().toLowerCase(Locale.ROOT) + " in " + c.unit);
            }
        }
        return found;
    }

    private static Column unitColumn(String file, int line, int i, String raw, Quantity q, String unit) {
        String u = unit.toLowerCase(Locale.ROOT);
        String where = "header, column " + (i + 1) + " '" + raw + "'";
        switch (q) {
            case TIME -> {
                switch (u) {
                    case "min", "minute", "minutes", "mn" -> { return new Column(i, raw, q, "min", 60, 0); }
                    case "s", "sec", "second", "seconds" -> { return new Column(i, raw, q, "s", 1, 0); }
                    case "h", "hour", "hours" -> { return new Column(i, raw, q, "h", 3600, 0); }
                    default -> throw badUnit(file, line, where, unit, "min, s or h");
                }
            }
            case TEMPERATURE -> {
                switch (u) {
                    case "c", "°c", "degc", "deg c", "celsius", "oc", "ºc" -> {
                        return new Column(i, raw, q, "°C", 1, PhysicalConstants.ZERO_CELSIUS_K);
                    }
                    case "k", "kelvin" -> { return new Column(i, raw, q, "K", 1, 0); }
                    default -> throw badUnit(file, line, where, unit, "C (°C) or K");
                }
            }
            case MASS -> {
                switch (u) {
                    case "mg" -> { return new Column(i, raw, q, "mg", 1e-6, 0); }
                    case "g" -> { return new Column(i, raw, q, "g", 1e-3, 0); }
                    case "ug", "µg", "μg" -> { return new Column(i, raw, q, "µg", 1e-9, 0); }
                    case "%", "pct", "percent", "wt%", "wt %", "wt.%" -> { return new Column(i, raw, q, "%", 1e-2, 0); }
                    default -> throw badUnit(file, line, where, unit, "mg, g, µg or %");
                }
            }
            default -> {
                return null;
            }
        }
    }

    private static InputException badUnit(String file, int line, String where, String unit, String expected) {
        return new InputException(ErrorKind.BAD_UNIT, file, where, line, unit.isEmpty()
                ? "no unit in the column name; expected one of " + expected + " (e.g. 'time_min', 'Temp [°C]')"
                : "unit '" + unit + "' not known; expected one of " + expected);
    }

    private static String stem(String fileName) {
        String n = Path.of(fileName).getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }
}

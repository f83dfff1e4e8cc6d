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

    private enum Quantity { TIME, TEMPERATURE, MASS, RUN, SEGMENT }

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
                    + maxBytes / (1024 * 1024) + " MB cap; split the file or keep fewer rows");
        }
        if (content.indexOf('\0') >= 0) {
            throw new InputException(ErrorKind.SYNTAX, fileName, "", 0,
                    "not a text file (contains NUL bytes); export the run from the instrument as text (CSV or TXT)");
        }
        if (content.startsWith("\uFEFF")) {
            content = content.substring(1);
        }
        String[] lines = content.split("\r\n|\n|\r", -1);
        List<String> notes = new ArrayList<>();
        Map<String, String> meta = new LinkedHashMap<>();
        int h = -1;
        boolean any = false;
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i];
            if (line.isBlank()) {
                continue;
            }
            any |= !line.trim().startsWith("#");
            if (!line.trim().startsWith("#") && isHeader(line)) {
                h = i;
                break;
            }
            metadata(line, meta);
        }
        if (!any) {
            throw new InputException(ErrorKind.EMPTY_FILE, fileName, "", 0,
                    "the file is empty; expected a header such as 'time_min,temperature_C,mass_mg' and data rows");
        }
        if (h < 0) {
            throw new InputException(ErrorKind.MISSING_KEY, fileName, "header", 0,
                    "no header row naming time, temperature and mass columns; add one such as "
                    + "'time_min,temperature_C,mass_mg' (or 'Time/min;Sample temperature/°C;Mass/%') above the data");
        }
        if (!meta.isEmpty()) {
            notes.add(fileName + ": metadata block of " + meta.size() + " line(s) kept as run metadata"
                    + describeMetadata(meta));
        }
        char sep = separator(lines[h]);
        notes.add(fileName + ": separator " + sepName(sep)
                + (sep != ',' ? ", decimal point or comma" : ", decimal point (or a decimal comma inside quotes)"));

        List<Layout> layouts = new ArrayList<>();
        Map<String, Series> groups = new LinkedHashMap<>();
        Layout layout = null;
        int block = 0;
        for (int li = h; li < lines.length; li++) {
            String line = lines[li];
            if (line.isBlank() || line.trim().startsWith("#")) {
                continue;
            }
            int row = li + 1;
            String[] cells = split(line, sep);
            double[] v = null;
            InputException bad = null;
            if (layout != null) {
                try {
                    v = layout.values(fileName, row, cells);
                } catch (InputException e) {
                    bad = e;
                }
            }
            if (v == null && (layout == null || isHeader(line))) {
                String[] names = cells;
                int next = nextContent(lines, li + 1);
                String[] units = next >= 0 ? unitRow(lines[next], sep, names.length) : null;
                if (units != null) {
                    for (int c = 0; c < names.length && c < units.length; c++) {
                        if (!units[c].isEmpty()) {
                            names[c] = names[c] + " [" + units[c] + "]";
                        }
                    }
                    notes.add(fileName + ": line " + (next + 1) + " read as a row of units");
                }
                layout = layout(fileName, row, names, sep, block == 0 ? notes : new ArrayList<>(), meta);
                layouts.add(layout);
                block++;
                if (units != null) {
                    li = next;
                }
                continue;
            }
            if (v == null) {
                int next = nextDataOrHeader(lines, li + 1, layout);
                if (next < 0 && !groups.isEmpty()) {
                    int rest = 0;
                    for (int k = li; k < lines.length; k++) {
                        rest += lines[k].isBlank() ? 0 : 1;
                    }
                    notes.add(fileName + ": " + rest + " line(s) from line " + row + " after the data ignored (footer)");
                    break;
                }
                if (next >= 0 && isHeader(lines[next])) {
                    notes.add(fileName + ": line " + row + " before the next header ignored (block title)");
                    continue;
                }
                throw bad;
            }
            String key = block + "\u0000" + (layout.group == null ? "" : cells[layout.group.index].trim());
            Series s = groups.computeIfAbsent(key, k -> new Series());
            s.block = block;
            s.group = layout.group == null ? null : cells[layout.group.index].trim();
            s.groupName = layout.group == null ? null : layout.group.quantity;
            s.basis = layout.basis();
            if (s.size > 0 && v[0] == s.time[s.size - 1]) {
                s.merge(v[1], v[2]);
                continue;
            }
            if (s.size > 0 && !(v[0] > s.time[s.size - 1])) {
                Column ct = layout.time;
                throw new InputException(ErrorKind.INCONSISTENT, fileName, where(row, ct), row, "time "
                        + cells[ct.index].trim() + " goes back (previous row " + s.row[s.size - 1] + "); if the file "
                        + "holds several runs or segments, give each its own header line or add a 'segment' or 'run' "
                        + "column, otherwise sort the rows by time");
            }
            s.add(v[0], v[1], v[2], row);
        }
        if (groups.isEmpty()) {
            throw new InputException(ErrorKind.EMPTY_FILE, fileName, "", h + 1,
                    "header but no data rows; export the data table with the header");
        }
        String stem = stem(fileName);
        boolean several = groups.size() > 1;
        List<TgaRun> out = new ArrayList<>();
        Map<String, Map<String, String>> metadata = new LinkedHashMap<>();
        List<String> available = new ArrayList<>();
        for (Series s : groups.values()) {
            String id = s.group != null ? s.group : String.valueOf(s.block);
            available.add(id);
            if (segment != null && !segment.trim().equals(id)) {
                continue;
            }
            String label = !several && segment == null ? stem : stem + ":" + (s.group != null
                    ? (s.groupName == Quantity.RUN ? s.group : "segment " + s.group) : "block " + s.block);
            if (s.merged > 0) {
                notes.add(fileName + ": " + label + ": " + s.merged + " repeated time stamp(s) (time rounded in the "
                        + "export?) merged by averaging their rows");
            }
            double rise = s.rise();
            if (rise < MIN_HEATING_RISE_K && several) {
                notes.add(String.format(Locale.ROOT, "%s: %s: temperature rises by %.1f K only (a hold or a cooling "
                        + "segment), skipped", fileName, label, rise));
                continue;
            }
            if (s.size < TgaRun.MIN_POINTS) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, fileName, s.group == null ? "" : "run " + s.group,
                        s.size == 0 ? 0 : s.row[s.size - 1], s.size + " data rows, at least " + TgaRun.MIN_POINTS
                        + " needed for a run; export the run at a finer sampling interval");
            }
            if (rise < MIN_HEATING_RISE_K) {
                throw new InputException(ErrorKind.INCONSISTENT, fileName, "", 0, String.format(Locale.ROOT,
                        "the sample temperature rises by %.1f K only: a heating run is expected; export the heating ramp", rise));
            }
            out.add(new TgaRun(label, java.util.Arrays.copyOf(s.time, s.size), java.util.Arrays.copyOf(s.temp, s.size),
                    java.util.Arrays.copyOf(s.mass, s.size), s.basis));
            if (!meta.isEmpty()) {
                metadata.put(label, meta);
            }
        }
        if (out.isEmpty()) {
            if (segment != null && !available.contains(segment.trim())) {
                throw new InputException(ErrorKind.BAD_ARGUMENT, fileName, "--segment", 0, "no segment '" + segment
                        + "' in the file; it has " + String.join(", ", available));
            }
            throw new InputException(ErrorKind.INCONSISTENT, fileName, "", 0, "no heating segment: the temperature "
                    + "rises by less than " + MIN_HEATING_RISE_K + " K in every segment; export the heating ramp");
        }
        if (several) {
            notes.add(fileName + ": " + groups.size() + " segments or runs found (" + String.join(", ", available)
                    + "); " + out.size() + " used" + (segment == null ? "" : " (--segment " + segment + ")"));
        }
        return new Result(out, notes, metadata);
    }

    /** Smallest temperature rise of a segment taken as a heating run [K]. */
    public static final double MIN_HEATING_RISE_K = 5;

    /** How the columns of one block are read. */
    private static final class Layout {
        Column time;
        Column temp;
        Column mass;
        Column group;
        int needed;
        boolean commaDecimal;
        /** Mass column kind: 0 mass, 1 change (m0 + v), 2 loss (m0 − v). */
        int massKind;
        /** Initial mass for an absolute change or loss, in the column's unit scaled to SI; NaN when relative. */
        double reference;

        TgaRun.MassBasis basis() {
            return mass.unit.equals("%") ? TgaRun.MassBasis.FRACTION : TgaRun.MassBasis.KILOGRAM;
        }

        double[] values(String file, int row, String[] cells) {
            if (cells.length < needed) {
                throw new InputException(ErrorKind.SYNTAX, file, "row " + row, row, "has " + cells.length
                        + " fields, expected at least " + needed + "; complete or delete the row");
            }
            double t = timeValue(file, row, time, cells[time.index], commaDecimal);
            double tk = number(file, row, temp, cells[temp.index], commaDecimal) * temp.scale + temp.offset;
            double m = number(file, row, mass, cells[mass.index], commaDecimal) * mass.scale;
            if (massKind == 1) {
                m = (Double.isNaN(reference) ? 1 : reference) + m;
            } else if (massKind == 2) {
                m = (Double.isNaN(reference) ? 1 : reference) - m;
            }
            if (!(tk > 0)) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, file, where(row, temp), row, "temperature "
                        + cells[temp.index].trim() + " " + temp.unit + " is at or below absolute zero; check the "
                        + "column's unit in the header");
            }
            return new double[] {t, tk, m};
        }
    }

    private Layout layout(String fileName, int line, String[] names, char sep, List<String> notes,
                          Map<String, String> meta) {
        Map<Quantity, List<Column>> found = classify(fileName, line, names, notes);
        for (Quantity q : List.of(Quantity.TIME, Quantity.TEMPERATURE, Quantity.MASS)) {
            if (!found.containsKey(q)) {
                throw new InputException(ErrorKind.MISSING_KEY, fileName, "header", line, "no "
                        + q.name().toLowerCase(Locale.ROOT) + " column among " + String.join(" | ", names)
                        + "; name one column e.g. " + example(q));
            }
        }
        Layout l = new Layout();
        l.commaDecimal = sep != ',';
        l.time = found.get(Quantity.TIME).get(0);
        l.temp = chooseTemperature(fileName, line, found.get(Quantity.TEMPERATURE), notes);
        l.mass = found.get(Quantity.MASS).get(0);
        l.group = found.containsKey(Quantity.RUN) ? found.get(Quantity.RUN).get(0)
                : found.containsKey(Quantity.SEGMENT) ? found.get(Quantity.SEGMENT).get(0) : null;
        String mh = l.mass.header.toLowerCase(Locale.ROOT);
        l.massKind = mh.contains("loss") ? 2 : mh.contains("change") || mh.contains("delta") || mh.contains("Δ") ? 1 : 0;
        l.reference = Double.NaN;
        if (l.massKind > 0) {
            if (l.mass.unit.equals("%")) {
                l.reference = 1;
                notes.add(fileName + ": mass " + (l.massKind == 1 ? "change" : "loss") + " in % read as mass = 100 % "
                        + (l.massKind == 1 ? "+" : "-") + " value");
            } else {
                double m0 = sampleMass(meta);
                if (Double.isNaN(m0)) {
                    throw new InputException(ErrorKind.MISSING_KEY, fileName, "header, column " + (l.mass.index + 1)
                            + " '" + l.mass.header + "'", line, "an absolute mass " + (l.massKind == 1 ? "change" : "loss")
                            + " needs the initial sample mass, and the metadata above the table gives none; add a line "
                            + "such as 'Sample mass: 10.0 mg' above the header, or export the mass itself or the change in %");
                }
                l.reference = m0;
                notes.add(String.format(Locale.ROOT, "%s: mass %s in %s read as mass = sample mass %.4g mg %s value",
                        fileName, l.massKind == 1 ? "change" : "loss", l.mass.unit, m0 * 1e6, l.massKind == 1 ? "+" : "-"));
            }
        }
        int needed = Math.max(Math.max(l.time.index, l.temp.index), l.mass.index);
        if (l.group != null) {
            needed = Math.max(needed, l.group.index);
        }
        l.needed = needed + 1;
        return l;
    }

    private Column chooseTemperature(String file, int line, List<Column> candidates, List<String> notes) {
        List<String> listed = new ArrayList<>();
        for (Column c : candidates) {
            listed.add((c.index + 1) + " '" + c.header + "'");
        }
        if (temperatureColumn != null) {
            String want = temperatureColumn.trim();
            for (Column c : candidates) {
                if (want.equals(String.valueOf(c.index + 1)) || c.header.trim().equalsIgnoreCase(want)) {
                    notes.add(file + ": column " + (c.index + 1) + " '" + c.header + "' taken as the sample temperature "
                            + "(--temperature-column)");
                    return c;
                }
            }
            throw new InputException(ErrorKind.BAD_ARGUMENT, file, "--temperature-column", line, "'" + want
                    + "' is not a temperature column; the candidates are " + String.join(", ", listed));
        }
        if (candidates.size() == 1) {
            return candidates.get(0);
        }
        List<Column> sample = new ArrayList<>();
        List<Column> other = new ArrayList<>();
        for (Column c : candidates) {
            String n = c.header.toLowerCase(Locale.ROOT);
            if (n.contains("sample") || n.contains("specimen")) {
                sample.add(c);
            } else if (!(n.contains("program") || n.contains("furnace") || n.contains("oven") || n.contains("set")
                    || n.contains("reference") || n.contains("block") || n.contains("heater"))) {
                other.add(c);
            }
        }
        List<Column> pick = sample.size() == 1 ? sample : sample.isEmpty() && other.size() == 1 ? other : null;
        if (pick == null) {
            throw new InputException(ErrorKind.INCONSISTENT, file, "header", line, "several temperature columns and "
                    + "none is plainly the sample's: " + String.join(", ", listed)
                    + "; choose one with --temperature-column (its header text or number)");
        }
        for (Column c : candidates) {
            if (c != pick.get(0)) {
                notes.add(file + ": column " + (c.index + 1) + " '" + c.header + "' ignored in favour of the sample "
                        + "temperature (column " + (pick.get(0).index + 1) + "; --temperature-column to choose another)");
            }
        }
        return pick.get(0);
    }

    /** Sample mass from a metadata line such as 'Sample mass: 10.2 mg' [kg], or NaN. */
    private static double sampleMass(Map<String, String> meta) {
        for (Map.Entry<String, String> e : meta.entrySet()) {
            String k = e.getKey().toLowerCase(Locale.ROOT);
            if ((k.contains("mass") || k.contains("weight")) && (k.contains("sample") || k.contains("initial"))) {
                java.util.regex.Matcher m = Pattern.compile("^\\s*([0-9]+(?:[.,][0-9]+)?)\\s*(mg|g|µg|ug)\\s*$")
                        .matcher(e.getValue());
                if (m.matches()) {
                    double v = Double.parseDouble(m.group(1).replace(',', '.'));
                    return switch (m.group(2)) {
                        case "g" -> v * 1e-3;
                        case "µg", "ug" -> v * 1e-9;
                        default -> v * 1e-6;
                    };
                }
            }
        }
        return Double.NaN;
    }

    private static String describeMetadata(Map<String, String> meta) {
        List<String> seen = new ArrayList<>();
        for (Map.Entry<String, String> e : meta.entrySet()) {
            String k = e.getKey().toLowerCase(Locale.ROOT);
            if (k.contains("rate") || k.contains("atmosphere") || k.contains("gas") || k.contains("purge")
                    || (k.contains("mass") || k.contains("weight")) && (k.contains("sample") || k.contains("initial"))) {
                seen.add(e.getKey() + " = " + e.getValue());
            }
        }
        return seen.isEmpty() ? "" : " (" + String.join("; ", seen) + "; the heating rate used is the one measured)";
    }

    private static final Pattern META = Pattern.compile("^\\s*#?\\s*([^:;\\t=,]{1,60}?)\\s*[:;\\t=,]\\s*(.*?)[\\s;,\\t]*$");

    private static void metadata(String line, Map<String, String> meta) {
        java.util.regex.Matcher m = META.matcher(line);
        if (m.matches() && !m.group(1).isBlank() && !m.group(2).isBlank()) {
            String v = m.group(2).trim();
            if (v.length() >= 2 && v.startsWith("\"") && v.endsWith("\"")) {
                v = v.substring(1, v.length() - 1);
            }
            meta.putIfAbsent(m.group(1).trim(), v);
        }
    }

    private static char separator(String header) {
        return header.indexOf('\t') >= 0 ? '\t' : header.indexOf(';') >= 0 ? ';' : ',';
    }

    private static String sepName(char sep) {
        return sep == '\t' ? "tab" : "'" + sep + "'";
    }

    /** A header names at least two of time, temperature and mass, and is not a row of numbers. */
    private static boolean isHeader(String line) {
        String[] cells = split(line, separator(line));
        java.util.EnumSet<Quantity> q = java.util.EnumSet.noneOf(Quantity.class);
        int numeric = 0;
        for (String c : cells) {
            if (NUMBER.matcher(c.replace(',', '.')).matches()) {
                numeric++;
            }
            Quantity k = quantityOf(c.toLowerCase(Locale.ROOT));
            if (k != null) {
                q.add(k);
            }
        }
        q.remove(Quantity.RUN);
        q.remove(Quantity.SEGMENT);
        return q.size() >= 2 && numeric < cells.length / 2 + 1;
    }

    private static boolean parses(String line, Layout layout) {
        try {
            layout.values("", 0, split(line, separator(line)));
            return true;
        } catch (InputException e) {
            return false;
        }
    }

    private static int nextContent(String[] lines, int from) {
        for (int i = from; i < lines.length; i++) {
            if (!lines[i].isBlank() && !lines[i].trim().startsWith("#")) {
                return i;
            }
        }
        return -1;
    }

    private static int nextDataOrHeader(String[] lines, int from, Layout layout) {
        for (int i = from; i < lines.length; i++) {
            String l = lines[i];
            if (l.isBlank() || l.trim().startsWith("#")) {
                continue;
            }
            if (isHeader(l) || parses(l, layout)) {
                return i;
            }
        }
        return -1;
    }

    private static final Pattern UNIT_TOKEN = Pattern.compile("^[\\[(]?\\s*(%|[a-zA-Z°ºµμ℃/.]{1,12}|hh:mm:ss|h:mm:ss|mm:ss)\\s*[\\])]?$");

    /** The cells of a row of units below a header, or null when the line is not one. */
    private static String[] unitRow(String line, char sep, int width) {
        String[] cells = split(line, sep);
        int units = 0;
        for (String c : cells) {
            if (c.isEmpty()) {
                continue;
            }
            if (!UNIT_TOKEN.matcher(c).matches()) {
                return null;
            }
            units++;
        }
        if (units < 2) {
            return null;
        }
        String[] out = new String[cells.length];
        for (int i = 0; i < cells.length; i++) {
            out[i] = cells[i].replaceAll("^[\\[(]\\s*|\\s*[\\])]$", "");
        }
        return out;
    }

    private static final class Series {
        double[] time = new double[1024];
        double[] temp = new double[1024];
        double[] mass = new double[1024];
        int[] row = new int[1024];
        int size;
        int block;
        String group;
        Quantity groupName;
        TgaRun.MassBasis basis;
        int merged;
        int repeat = 1;

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
            repeat = 1;
        }

        /** Another row with the last row's time stamp: running average. */
        void merge(double tk, double m) {
            repeat++;
            temp[size - 1] += (tk - temp[size - 1]) / repeat;
            mass[size - 1] += (m - mass[size - 1]) / repeat;
            merged++;
        }

        double rise() {
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < size; i++) {
                lo = Math.min(lo, temp[i]);
                hi = Math.max(hi, temp[i]);
            }
            // A heating segment ends hotter than it starts.
            return size > 1 && temp[size - 1] > temp[0] ? hi - lo : 0;
        }
    }

    /** Splits on the separator outside double quotes; quotes are removed and cells trimmed. */
    private static String[] split(String line, char sep) {
        List<String> parts = new ArrayList<>();
        StringBuilder cur = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == '"') {
                if (quoted && i + 1 < line.length() && line.charAt(i + 1) == '"') {
                    cur.append('"');
                    i++;
                } else {
                    quoted = !quoted;
                }
            } else if (c == sep && !quoted) {
                parts.add(cur.toString().trim());
                cur.setLength(0);
            } else {
                cur.append(c);
            }
        }
        parts.add(cur.toString().trim());
        return parts.toArray(new String[0]);
    }

    private static final Pattern HMS = Pattern.compile("^(\\d+):([0-5]?\\d)(?::([0-5]?\\d(?:[.,]\\d+)?))?$");

    private static double timeValue(String file, int row, Column c, String cell, boolean commaDecimal) {
        java.util.regex.Matcher m = HMS.matcher(cell.trim());
        if (m.matches()) {
            double a = Double.parseDouble(m.group(1)), b = Double.parseDouble(m.group(2));
            if (m.group(3) == null) {
                return a * 60 + b; // mm:ss
            }
            return a * 3600 + b * 60 + Double.parseDouble(m.group(3).replace(',', '.'));
        }
        if (c.scale == 0) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, where(row, c), row, "'" + cell.trim()
                    + "' is not a time in hh:mm:ss; fix or delete the row");
        }
        return number(file, row, c, cell, commaDecimal) * c.scale + c.offset;
    }

    private static double number(String file, int row, Column c, String cell, boolean commaDecimal) {
        String s = cell.trim();
        // A decimal comma is accepted with ';' or tab separators, and inside quotes with ','.
        if (commaDecimal || s.matches("[+-]?\\d+,\\d+(?:[eE][+-]?\\d+)?")) {
            s = s.replace(',', '.');
        }
        if (!NUMBER.matcher(s).matches()) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, where(row, c), row, "'" + cell.trim()
                    + "' is not a number; expected a finite decimal number"
                    + (commaDecimal ? " (point or comma)" : " with a decimal point") + "; fix or delete the row");
        }
        double v = Double.parseDouble(s);
        if (!Double.isFinite(v)) {
            throw new InputException(ErrorKind.BAD_NUMBER, file, where(row, c), row, "'" + cell.trim()
                    + "' is too large; fix or delete the row");
        }
        return v;
    }

    private static String where(int row, Column c) {
        return "row " + row + ", column " + (c.index + 1) + " '" + c.header + "'";
    }

    private static String example(Quantity q) {
        return switch (q) {
            case TIME -> "'time_min', 'time_s', 'Time (min)' or 'Time [hh:mm:ss]'";
            case TEMPERATURE -> "'temperature_C', 'temperature_K' or 'Sample temperature [°C]'";
            case MASS -> "'mass_mg', 'mass_pct', 'Mass/%' or 'Mass change/%'";
            case RUN -> "'run'";
            case SEGMENT -> "'segment'";
        };
    }

    /** The quantity a header cell names, or null. */
    private static Quantity quantityOf(String n) {
        String[] words = n.trim().split("[\\s_()\\[\\]/,:{}.-]+");
        if (words.length == 0 || n.isBlank()) {
            return null;
        }
        String first = words[0];
        if (n.contains("deriv") || n.contains("rate") || n.contains("dtg") || n.contains("/dt") || n.contains("heat flow")
                || n.contains("dsc")) {
            return null;
        }
        if (n.trim().matches("run|run[ _]?id|run no\\.?|run number")) {
            return Quantity.RUN;
        }
        if (n.trim().matches("(segment|seg|seg\\.|step|ramp)( ?(no\\.?|number|#|id))?")) {
            return Quantity.SEGMENT;
        }
        for (String w : words) {
            if (w.startsWith("temp") || w.equals("ts")) {
                return Quantity.TEMPERATURE;
            }
        }
        if (first.equals("time") || first.equals("t") || n.contains("time")) {
            return Quantity.TIME;
        }
        for (String w : words) {
            if (w.equals("mass") || w.equals("weight") || w.equals("wt") || w.equals("tg") || w.equals("tga")) {
                return Quantity.MASS;
            }
        }
        return null;
    }

    private static Map<Quantity, List<Column>> classify(String file, int line, String[] names, List<String> notes) {
        Map<Quantity, List<Column>> found = new LinkedHashMap<>();
        for (int i = 0; i < names.length; i++) {
            String raw = names[i];
            String n = raw.toLowerCase(Locale.ROOT).trim();
            Quantity q = quantityOf(n);
            if (q == null) {
                if (!raw.isBlank()) {
                    notes.add(file + ": column " + (i + 1) + " '" + raw + "' not recognised, ignored");
                }
                continue;
            }
            if (q == Quantity.RUN || q == Quantity.SEGMENT) {
                found.computeIfAbsent(q, k -> new ArrayList<>()).add(new Column(i, raw, q, "", 1, 0));
                continue;
            }
            Column c = unitColumn(file, line, i, raw, q, unitOf(n, q));
            List<Column> list = found.computeIfAbsent(q, k -> new ArrayList<>());
            if (q != Quantity.TEMPERATURE && !list.isEmpty()) {
                notes.add(file + ": column " + (i + 1) + " '" + raw + "' ignored, " + q.name().toLowerCase(Locale.ROOT)
                        + " already taken from column " + (list.get(0).index + 1));
                continue;
            }
            list.add(c);
        }
        for (List<Column> cs : found.values()) {
            for (Column c : cs) {
                if (c.quantity != Quantity.RUN && c.quantity != Quantity.SEGMENT
                        && (c.quantity != Quantity.TEMPERATURE || cs.size() == 1)) {
                    notes.add(file + ": column " + (c.index + 1) + " '" + c.header + "' taken as "
                            + c.quantity.name().toLowerCase(Locale.ROOT) + " in " + c.unit);
                } else if (c.quantity == Quantity.TEMPERATURE) {
                    notes.add(file + ": column " + (c.index + 1) + " '" + c.header + "' is a temperature in " + c.unit);
                }
            }
        }
        return found;
    }

    /** The unit text of a header cell: inside the last brackets, after the last '/', or after the quantity word. */
    private static String unitOf(String n, Quantity q) {
        java.util.regex.Matcher br = Pattern.compile("[\\[(]([^\\[\\]()]*)[\\])]\\s*$").matcher(n);
        if (br.find()) {
            return br.group(1).trim().replace("℃", "°c");
        }
        int slash = n.lastIndexOf('/');
        if (slash >= 0 && !n.contains("/dt")) {
            return n.substring(slash + 1).trim().replace("℃", "°c");
        }
        String[] key = switch (q) {
            case TIME -> new String[] {"time", "t"};
            case TEMPERATURE -> new String[] {"temperature", "temp", "ts"};
            default -> new String[] {"mass", "weight", "wt", "tga", "tg"};
        };
        for (String k : key) {
            int at = n.indexOf(k);
            if (at >= 0) {
                String rest = n.substring(at + k.length());
                if (q == Quantity.MASS && rest.trim().startsWith("%")) {
                    return "%";
                }
                return rest.replaceAll("^[\\s_()\\[\\]/,:{}-]+", "").replaceAll("[\\s()\\[\\]{}]+$", "")
                        .replaceAll("^(change|loss)[\\s_]*", "").replace("℃", "°c").trim();
            }
        }
        return "";
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
                    case "hh:mm:ss", "h:mm:ss", "mm:ss", "hms" -> { return new Column(i, raw, q, "hh:mm:ss", 0, 0); }
                    default -> throw badUnit(file, line, where, unit, "min, s, h or hh:mm:ss");
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
                ? "no unit in the column name; add one of " + expected + " to it (e.g. 'time_min', 'Temp [°C]') or "
                + "put a row of units under the header"
                : "unit '" + unit + "' not known; rename the column with one of " + expected);
    }

    private static String stem(String fileName) {
        String n = Path.of(fileName).getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }
}

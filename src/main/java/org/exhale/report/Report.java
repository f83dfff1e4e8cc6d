package org.exhale.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.exhale.io.AtomicFiles;
import org.exhale.io.OutputFolder;

/**
 * The report of one output folder: the page and every chart as SVG and PNG.
 *
 * <pre>{@code
 * Report r = Report.of(RunFolder.read(dir), "charts/");
 * r.write(dir, dir.resolve("report.html"));
 * }</pre>
 *
 * @param html    the self-contained page
 * @param figures the charts, in page order
 * @param svg     each chart as a standalone SVG document, by figure id
 * @param png     each chart as PNG, by figure id
 */
public record Report(String html, List<Figure> figures, Map<String, String> svg, Map<String, byte[]> png) {
    /** Folder of the chart files, inside the output folder. */
    public static final String CHARTS = "charts";

    /** Builds the charts the folder's files allow, renders them and the page. */
    public static Report of(RunFolder folder, String chartsHref) {
        List<Figure> figures = figures(folder);
        Map<String, String> inline = new LinkedHashMap<>();
        Map<String, String> svg = new LinkedHashMap<>();
        Map<String, byte[]> png = new LinkedHashMap<>();
        // charts are independent: render them side by side (each chart is drawn by one thread only)
        List<Object[]> done = figures.parallelStream().map(f -> {
            String s = ChartRenderer.svg(f.chart(), ChartStyle.WIDTH, ChartStyle.HEIGHT, f.id() + "-", true);
            byte[] p = ChartRenderer.png(f.chart(), ChartStyle.WIDTH, ChartStyle.HEIGHT);
            return new Object[]{f.id(), s, p};
        }).toList();
        for (Object[] d : done) {
            inline.put((String) d[0], (String) d[1]);
            svg.put((String) d[0], "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + d[1] + "\n");
            png.put((String) d[0], (byte[]) d[2]);
        }
        String binding = folder.summary().map(s -> RecipeSheet.tightestName(s.path("margins"))).orElse(null);
        String html = HtmlReport.render(folder, figures, inline, chartsHref, binding);
        return new Report(html, figures, svg, png);
    }

    static List<Figure> figures(RunFolder folder) {
        List<Figure> out = new ArrayList<>();
        folder.history().ifPresent(h -> out.addAll(new BakeCharts(h,
                folder.summary().map(s -> s.path("margins")).orElse(null),
                folder.summary().map(s -> s.path("corners")).orElse(null), folder.caseName())
                .names(folder.summary().map(s -> s.path("components")).orElse(null)).all()));
        PlanCharts.lowerBound(folder).ifPresent(out::add);
        if (folder.fit().isPresent() || folder.fitTable().isPresent() || folder.isoconversional().isPresent()) {
            out.addAll(new FitCharts(folder).all());
        }
        if (folder.compare().isPresent() || folder.options().isPresent()) {
            out.addAll(new CompareCharts(folder).all());
        }
        if (folder.robust().isPresent() || folder.samples().isPresent()) {
            out.addAll(new RobustCharts(folder).all());
        }
        return out;
    }

    /**
     * Writes the chart files into {@code dir/charts/} and the page to {@code page}; each file through a
     * temporary file and a move, so no reader sees half a file. Returns the files written.
     */
    public List<Path> write(Path dir, Path page) {
        return write(dir, page, true);
    }

    /**
     * As {@link #write(Path, Path)}; without {@code replacePage} an existing page other than
     * DIR/report.html is refused. A page outside DIR is written aside first, so that when it cannot be
     * written no chart is left behind.
     */
    public List<Path> write(Path dir, Path page, boolean replacePage) {
        boolean ownPage = page.toAbsolutePath().normalize().equals(dir.toAbsolutePath().normalize().resolve("report.html"));
        if (!replacePage && !ownPage && java.nio.file.Files.exists(page, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            throw new org.exhale.io.InputException(org.exhale.io.ErrorKind.OUTPUT, page.toString(), "", 0,
                    "exists; use --force to replace it, or choose another file with -o");
        }
        OutputFolder out = new OutputFolder(dir, true);
        List<Path> written = new ArrayList<>();
        for (Figure f : figures) {
            out.put(CHARTS + "/" + f.id() + ".svg", svg.get(f.id()));
            out.put(CHARTS + "/" + f.id() + ".png", png.get(f.id()));
            written.add(dir.resolve(CHARTS).resolve(f.id() + ".svg"));
            written.add(dir.resolve(CHARTS).resolve(f.id() + ".png"));
        }
        Path inside = dir.toAbsolutePath().normalize().relativize(page.toAbsolutePath().normalize());
        boolean inDir = !inside.startsWith("..") && inside.getNameCount() == 1;
        AtomicFiles.Staged staged = null;
        if (inDir) {
            out.put(inside.toString(), html);
        } else {
            staged = AtomicFiles.stage(page, html.getBytes(java.nio.charset.StandardCharsets.UTF_8));
        }
        try {
            out.commit();
        } catch (RuntimeException e) {
            if (staged != null) {
                staged.discard();
            }
            throw e;
        }
        if (staged != null) {
            staged.commit(replacePage || ownPage);
        }
        written.add(page);
        return written;
    }

    /** Where the chart files lie as seen from the page, with a trailing slash. */
    public static String chartsHref(Path dir, Path page) {
        Path from = page.toAbsolutePath().normalize().getParent();
        Path rel = from.relativize(dir.toAbsolutePath().normalize().resolve(CHARTS));
        String s = rel.toString().replace('\\', '/');
        return s.isEmpty() ? "" : s + "/";
    }
}

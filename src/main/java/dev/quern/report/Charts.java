package dev.quern.report;

import dev.quern.run.ColumnStats;
import dev.quern.run.ValueSketch;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.List;

/**
 * Inline SVG charts for the report: a histogram of a numeric column, a bar chart of a text column's most
 * frequent levels, bars per cutoff, and old-against-new bin shares. Every number is formatted with a fixed
 * locale and precision, so the same data gives the same bytes.
 */
final class Charts {

    /** Numeric columns with at most this many distinct values get one bar per value. */
    static final int MAX_VALUE_BARS = 24;
    /** Equal-width bins of a histogram. */
    static final int BINS = 20;
    /** Text levels shown; the rest are one "other levels" bar. */
    static final int TOP_LEVELS = 10;

    private static final int WIDTH = 320;
    private static final int HEIGHT = 120;
    private static final int PAD_LEFT = 44;
    private static final int PAD_BOTTOM = 22;
    private static final int PAD_TOP = 8;

    private Charts() {
    }

    /** One bar: its label, the rows in it, and the tooltip. */
    record Bar(String label, double value, String tip) {
    }

    /** The bars of a column's chart and a note on how they were counted (exact, or from a sample). */
    record Shape(List<Bar> bars, String note) {
    }

    static Shape numeric(ColumnStats stats) {
        ValueSketch sketch = stats.sketch().orElseThrow();
        long values = stats.values();
        if (values == 0) {
            return new Shape(List.of(), "no values");
        }
        double min = Double.parseDouble(stats.min().orElseThrow());
        double max = Double.parseDouble(stats.max().orElseThrow());
        // A column beyond its level limit is drawn from its sample: its levels are not needed.
        List<ValueSketch.Level> levels = sketch.levelsExact() ? sketch.levels() : List.of();
        if (sketch.levelsExact() && levels.size() <= MAX_VALUE_BARS) {
            List<ValueSketch.Level> sorted = new ArrayList<>(levels);
            sorted.sort(java.util.Comparator.comparingDouble(l -> Double.parseDouble(l.value())));
            List<Bar> bars = new ArrayList<>();
            for (ValueSketch.Level l : sorted) {
                bars.add(new Bar(l.value(), l.count(), l.value() + ": " + count(l.count()) + " rows"));
            }
            return new Shape(bars, "every value counted");
        }
        int bins = BINS;
        boolean integers = stats.type() == ValueType.INTEGER;
        if (integers && max - min + 1 <= BINS) {
            bins = (int) (max - min + 1);
        }
        double width = max > min ? (max - min) / bins : 1;
        if (integers && max - min + 1 <= BINS) {
            width = 1;
        }
        double[] counts = new double[bins];
        String note;
        if (sketch.levelsExact()) {
            for (ValueSketch.Level l : levels) {
                counts[bin(Double.parseDouble(l.value()), min, width, bins)] += l.count();
            }
            note = "every value counted";
        } else {
            double[] sample = sketch.sample();
            double scale = (double) values / sample.length;
            for (double v : sample) {
                counts[bin(v, min, width, bins)] += scale;
            }
            note = sketch.sampleComplete() ? "every value counted"
                    : "estimated from a uniform sample of " + count(sample.length) + " of " + count(values) + " values";
        }
        List<Bar> bars = new ArrayList<>();
        for (int i = 0; i < bins; i++) {
            double from = min + i * width;
            double to = i == bins - 1 ? max : min + (i + 1) * width;
            String range = integers && width == 1 ? Bins.number(from)
                    : "[" + Bins.number(from) + ", " + Bins.number(to) + (i == bins - 1 ? "]" : ")");
            long n = Math.round(counts[i]);
            bars.add(new Bar(range, counts[i], range + ": " + (sketch.levelsExact() ? "" : "about ") + count(n)
                    + " rows"));
        }
        return new Shape(bars, note);
    }

    private static int bin(double v, double min, double width, int bins) {
        int i = (int) Math.floor((v - min) / width);
        return Math.max(0, Math.min(bins - 1, i));
    }

    static Shape text(ColumnStats stats) {
        ValueSketch sketch = stats.sketch().orElseThrow();
        long values = stats.values();
        if (values == 0) {
            return new Shape(List.of(), "no values");
        }
        List<ValueSketch.Level> levels = sketch.levels();
        List<Bar> bars = new ArrayList<>();
        long shown = 0;
        for (ValueSketch.Level l : levels.subList(0, Math.min(TOP_LEVELS, levels.size()))) {
            bars.add(new Bar(l.value(), l.count(), l.value() + ": " + count(l.count()) + " rows"));
            shown += l.count();
        }
        long rest = values - shown;
        int others = levels.size() - bars.size();
        if (rest > 0) {
            String label = sketch.levelsExact() ? others + " other levels" : "other levels";
            bars.add(new Bar(label, rest, label + ": " + count(rest) + " rows"));
        }
        String note = sketch.levelsExact() ? levels.size() + (levels.size() == 1 ? " level" : " levels")
                : "more than " + count(levels.size()) + " levels; later new levels counted as other";
        return new Shape(bars, note);
    }

    /** Vertical bars with the first and last label under them (histograms, bars per cutoff). */
    static String columns(String cssClass, String title, List<Bar> bars, String yFormat) {
        StringBuilder svg = open(cssClass, title, WIDTH, HEIGHT);
        if (bars.isEmpty()) {
            return svg.append(empty(WIDTH, HEIGHT)).append("</svg>").toString();
        }
        double top = bars.stream().mapToDouble(Bar::value).max().orElse(0);
        double plotW = WIDTH - PAD_LEFT - 4;
        double plotH = HEIGHT - PAD_TOP - PAD_BOTTOM;
        double step = plotW / bars.size();
        double gap = step > 6 ? 1 : 0;
        axis(svg, top, plotH, yFormat);
        for (int i = 0; i < bars.size(); i++) {
            Bar b = bars.get(i);
            double h = top <= 0 ? 0 : plotH * b.value() / top;
            svg.append("<rect x=\"").append(f(PAD_LEFT + i * step)).append("\" y=\"").append(f(PAD_TOP + plotH - h))
                    .append("\" width=\"").append(f(Math.max(0.5, step - gap))).append("\" height=\"").append(f(h))
                    .append("\"><title>").append(Html.escape(b.tip())).append("</title></rect>");
        }
        double base = HEIGHT - PAD_BOTTOM + 14;
        svg.append("<text class=\"tick\" x=\"").append(PAD_LEFT).append("\" y=\"").append(f(base)).append("\">")
                .append(Html.escape(shorten(bars.get(0).label()))).append("</text>");
        if (bars.size() > 1) {
            svg.append("<text class=\"tick\" text-anchor=\"end\" x=\"").append(WIDTH - 4).append("\" y=\"")
                    .append(f(base)).append("\">").append(Html.escape(shorten(bars.get(bars.size() - 1).label())))
                    .append("</text>");
        }
        return svg.append("</svg>").toString();
    }

    /** Horizontal bars, one labelled row each (text levels). */
    static String rows(String cssClass, String title, List<Bar> bars) {
        int rowH = 16;
        int labelW = 110;
        int height = Math.max(2, bars.size()) * rowH + 6;
        StringBuilder svg = open(cssClass, title, WIDTH, height);
        if (bars.isEmpty()) {
            return svg.append(empty(WIDTH, height)).append("</svg>").toString();
        }
        double top = bars.stream().mapToDouble(Bar::value).max().orElse(0);
        double plotW = WIDTH - labelW - 56;
        for (int i = 0; i < bars.size(); i++) {
            Bar b = bars.get(i);
            double y = 3 + i * rowH;
            double w = top <= 0 ? 0 : plotW * b.value() / top;
            svg.append("<text class=\"tick\" text-anchor=\"end\" x=\"").append(labelW - 4).append("\" y=\"")
                    .append(f(y + 11)).append("\">").append(Html.escape(shorten(b.label()))).append("</text>");
            svg.append("<rect x=\"").append(labelW).append("\" y=\"").append(f(y + 2)).append("\" width=\"")
                    .append(f(Math.max(0.5, w))).append("\" height=\"").append(rowH - 4).append("\"><title>")
                    .append(Html.escape(b.tip())).append("</title></rect>");
            svg.append("<text class=\"tick\" x=\"").append(f(labelW + w + 4)).append("\" y=\"").append(f(y + 11))
                    .append("\">").append(count(Math.round(b.value()))).append("</text>");
        }
        return svg.append("</svg>").toString();
    }

    /** Old and new shares side by side per bin (drift). */
    static String paired(String title, List<Comparison.Bin> bins) {
        long oldTotal = bins.stream().mapToLong(Comparison.Bin::oldCount).sum();
        long newTotal = bins.stream().mapToLong(Comparison.Bin::newCount).sum();
        int rowH = 18;
        int labelW = 130;
        int height = bins.size() * rowH + 6;
        StringBuilder svg = open("drift-chart", title, WIDTH + 40, height);
        double plotW = WIDTH + 40 - labelW - 50;
        double top = 0;
        for (Comparison.Bin b : bins) {
            top = Math.max(top, Math.max(share(b.oldCount(), oldTotal), share(b.newCount(), newTotal)));
        }
        for (int i = 0; i < bins.size(); i++) {
            Comparison.Bin b = bins.get(i);
            double y = 3 + i * rowH;
            double o = share(b.oldCount(), oldTotal);
            double n = share(b.newCount(), newTotal);
            svg.append("<text class=\"tick\" text-anchor=\"end\" x=\"").append(labelW - 4).append("\" y=\"")
                    .append(f(y + 12)).append("\">").append(Html.escape(shorten(b.label()))).append("</text>");
            svg.append("<rect class=\"old\" x=\"").append(labelW).append("\" y=\"").append(f(y + 2))
                    .append("\" width=\"").append(f(top <= 0 ? 0 : plotW * o / top)).append("\" height=\"7\"><title>")
                    .append(Html.escape(b.label() + ": old " + percent(o))).append("</title></rect>");
            svg.append("<rect class=\"new\" x=\"").append(labelW).append("\" y=\"").append(f(y + 9))
                    .append("\" width=\"").append(f(top <= 0 ? 0 : plotW * n / top)).append("\" height=\"7\"><title>")
                    .append(Html.escape(b.label() + ": new " + percent(n))).append("</title></rect>");
            svg.append("<text class=\"tick\" x=\"").append(f(labelW + plotW + 4)).append("\" y=\"").append(f(y + 12))
                    .append("\">").append(percent(n)).append("</text>");
        }
        return svg.append("</svg>").toString();
    }

    private static StringBuilder open(String cssClass, String title, int width, int height) {
        return new StringBuilder().append("<svg class=\"").append(cssClass).append("\" role=\"img\" viewBox=\"0 0 ")
                .append(width).append(' ').append(height).append("\" width=\"").append(width).append("\" height=\"")
                .append(height).append("\" xmlns=\"http://www.w3.org/2000/svg\"><title>")
                .append(Html.escape(title)).append("</title>");
    }

    private static String empty(int width, int height) {
        return "<text class=\"tick\" x=\"" + width / 2 + "\" y=\"" + height / 2
                + "\" text-anchor=\"middle\">no values</text>";
    }

    private static void axis(StringBuilder svg, double top, double plotH, String yFormat) {
        svg.append("<line class=\"axis\" x1=\"").append(PAD_LEFT - 2).append("\" y1=\"").append(f(PAD_TOP + plotH))
                .append("\" x2=\"").append(WIDTH - 4).append("\" y2=\"").append(f(PAD_TOP + plotH)).append("\"/>");
        String label = yFormat.equals("share") ? percent(top) : count(Math.round(top));
        svg.append("<text class=\"tick\" text-anchor=\"end\" x=\"").append(PAD_LEFT - 5).append("\" y=\"")
                .append(PAD_TOP + 8).append("\">").append(label).append("</text>");
        svg.append("<text class=\"tick\" text-anchor=\"end\" x=\"").append(PAD_LEFT - 5).append("\" y=\"")
                .append(f(PAD_TOP + plotH)).append("\">0</text>");
    }

    private static double share(long part, long total) {
        return total == 0 ? 0 : (double) part / total;
    }

    static String percent(double share) {
        return fixed(100 * share, 1) + "%";
    }

    /** A whole number with commas between groups of three digits. */
    static String count(long n) {
        String digits = Long.toString(n);
        int sign = n < 0 ? 1 : 0;
        int length = digits.length() - sign;
        if (length <= 3) {
            return digits;
        }
        StringBuilder out = new StringBuilder(digits.length() + length / 3).append(digits, 0, sign);
        for (int i = 0; i < length; i++) {
            if (i > 0 && (length - i) % 3 == 0) {
                out.append(',');
            }
            out.append(digits.charAt(sign + i));
        }
        return out.toString();
    }

    private static String shorten(String label) {
        return label.length() <= 18 ? label : label.substring(0, 17) + "\u2026";
    }

    /** Coordinates to two decimals, without trailing zeros. */
    static String f(double v) {
        String s = fixed(v, 2);
        if (s.indexOf('.') >= 0) {
            int end = s.length();
            while (s.charAt(end - 1) == '0') {
                end--;
            }
            s = s.substring(0, s.charAt(end - 1) == '.' ? end - 1 : end);
        }
        return s.equals("-0") ? "0" : s;
    }

    /**
     * {@code v} with {@code places} decimals, as {@code String.format(Locale.ROOT, "%.Nf", v)} writes it: the
     * shortest decimal of the double rounded half up. A report has thousands of these; the formatter parses
     * its pattern every time, which took a fifth of a second of every build with a few dozen columns.
     */
    static String fixed(double v, int places) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        String text = java.math.BigDecimal.valueOf(v).setScale(places, java.math.RoundingMode.HALF_UP).toPlainString();
        // BigDecimal has no negative zero; the formatter keeps the sign of a value that rounds to zero.
        return (v < 0 || (v == 0 && 1 / v < 0)) && text.charAt(0) != '-' ? "-" + text : text;
    }
}

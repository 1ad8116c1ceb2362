package dev.nanoplan.desktop;

import dev.nanoplan.plan.LinkReport;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import javafx.application.Platform;
import javafx.beans.property.ReadOnlyBooleanProperty;
import javafx.beans.property.ReadOnlyBooleanWrapper;
import javafx.scene.chart.BarChart;
import javafx.scene.chart.CategoryAxis;
import javafx.scene.chart.LineChart;
import javafx.scene.chart.NumberAxis;
import javafx.scene.chart.XYChart;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * Charts of the selected link: channel taps, the count distributions with the threshold, mutual
 * information versus threshold, and error probability versus molecules per symbol (the budget
 * curve). Data come from {@link LinkDetails}, computed on a background thread.
 */
final class LinkChartsView {

    private static final ExecutorService WORKER = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "nanoplan-link-charts");
        t.setDaemon(true);
        return t;
    });

    private final PlannerViewModel vm;
    private final Label heading = new Label("Select a link to see its charts.");
    private final BarChart<String, Number> taps = new BarChart<>(new CategoryAxis(), new NumberAxis());
    private final LineChart<Number, Number> counts = new LineChart<>(new NumberAxis(), new NumberAxis());
    private final LineChart<Number, Number> mi = new LineChart<>(new NumberAxis(), new NumberAxis());
    private final LineChart<Number, Number> budget = new LineChart<>(new NumberAxis(), new NumberAxis());
    private final VBox box;
    private Future<?> running;
    private final ReadOnlyBooleanWrapper computing =
            new ReadOnlyBooleanWrapper(false);

    LinkChartsView(PlannerViewModel vm) {
        this.vm = vm;
        heading.setWrapText(true);
        setup(taps, "Channel taps p_k (slot k after release)", "k", "p_k");
        setup(counts, "Count distributions given 0 and 1, with threshold τ", "molecules counted", "probability");
        setup(mi, "Mutual information versus threshold", "threshold τ", "bits");
        setup(budget, "Error probability versus molecules per symbol", "molecules per \"1\"", "log10 error");
        counts.setCreateSymbols(false);
        mi.setCreateSymbols(false);
        box = new VBox(6, heading, taps, counts, mi, budget);
        box.setFillWidth(true);
        vm.tables().selectedLinkProperty().addListener((o, a, b) -> refresh(b));
    }

    /** True while chart data are being computed. */
    ReadOnlyBooleanProperty computingProperty() {
        return computing.getReadOnlyProperty();
    }

    Region node() {
        ScrollPane sp = new ScrollPane(box);
        sp.setFitToWidth(true);
        return sp;
    }

    private static void setup(XYChart<?, ?> c, String title, String x, String y) {
        c.setTitle(title);
        c.getXAxis().setLabel(x);
        c.getYAxis().setLabel(y);
        c.setAnimated(false);
        c.setLegendVisible(true);
        c.setPrefHeight(220);
        c.setMinHeight(200);
    }

    private void refresh(LinkReport l) {
        if (running != null) {
            running.cancel(true);
        }
        var s = vm.scenarioProperty().get();
        if (l == null || s == null) {
            heading.setText("Select a link to see its charts.");
            clear();
            return;
        }
        heading.setText(l.from() + " → " + l.to() + ": computing…");
        computing.set(true);
        running = WORKER.submit(() -> {
            try {
                LinkDetails d = LinkDetails.compute(s, l);
                Platform.runLater(() -> {
                    if (l.equals(vm.tables().selectedLinkProperty().get())) {
                        show(d);
                        computing.set(false);
                    }
                });
            } catch (RuntimeException e) {
                Platform.runLater(() -> {
                    heading.setText(l.from() + " → " + l.to() + ": " + e.getMessage());
                    computing.set(false);
                });
            }
        });
    }

    private void clear() {
        taps.getData().clear();
        counts.getData().clear();
        mi.getData().clear();
        budget.getData().clear();
    }

    private void show(LinkDetails d) {
        clear();
        heading.setText(d.link().from() + " → " + d.link().to() + " (isolated link: the plan's crosstalk is not "
                + "in these curves)");
        XYChart.Series<String, Number> t = new XYChart.Series<>();
        t.setName("hit probability per slot");
        double[] p = d.taps();
        for (int k = 0; k < p.length; k++) {
            t.getData().add(new XYChart.Data<>(Integer.toString(k), p[k]));
        }
        taps.getData().add(t);
        double top = 0;
        for (int i = 0; i < d.countCurves().size(); i++) {
            XYChart.Series<Number, Number> c = series("sent level " + i, d.countCurves().get(i));
            for (double[] pt : d.countCurves().get(i)) {
                top = Math.max(top, pt[1]);
            }
            counts.getData().add(c);
        }
        if (d.threshold() >= 0) {
            counts.getData().add(series("threshold τ = " + d.threshold(),
                    List.of(new double[] {d.threshold(), 0}, new double[] {d.threshold(), top})));
            mi.getData().add(series("MI at the prior", d.miByThreshold()));
            mi.getData().add(series("τ", List.of(new double[] {d.threshold(), 0}, new double[] {d.threshold(), 1})));
        }
        budget.getData().add(series("minimum error", d.errorByMolecules()));
        if (!d.errorByMolecules().isEmpty()) {
            double x0 = d.errorByMolecules().get(0)[0];
            double x1 = d.errorByMolecules().get(d.errorByMolecules().size() - 1)[0];
            budget.getData().add(series("target", List.of(new double[] {x0, d.targetLog10Error()},
                    new double[] {x1, d.targetLog10Error()})));
        }
    }

    private static XYChart.Series<Number, Number> series(String name, List<double[]> pts) {
        XYChart.Series<Number, Number> s = new XYChart.Series<>();
        s.setName(name);
        for (double[] pt : pts) {
            s.getData().add(new XYChart.Data<>(pt[0], pt[1]));
        }
        return s;
    }

}

package org.tufa.cli;

import com.sun.management.GarbageCollectionNotificationInfo;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryUsage;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;
import javax.management.ListenerNotFoundException;
import javax.management.Notification;
import javax.management.NotificationEmitter;
import javax.management.NotificationListener;
import javax.management.openmbean.CompositeData;

/**
 * Watches the heap from the garbage collector's notifications: the largest heap in use just before a collection
 * (the peak, since use only grows between collections) and the largest heap still in use just after one (the live
 * data the run needed). For the run's closing time line; the figures are diagnostics, not outputs.
 */
final class HeapWatch implements NotificationListener {

    private final AtomicLong peakBefore = new AtomicLong();
    private final AtomicLong peakAfter = new AtomicLong();
    private final List<NotificationEmitter> emitters = new ArrayList<>();

    private HeapWatch() {
    }

    /** Starts watching; call {@link #stop} when done. */
    static HeapWatch start() {
        HeapWatch w = new HeapWatch();
        for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
            if (gc instanceof NotificationEmitter e) {
                e.addNotificationListener(w, null, null);
                w.emitters.add(e);
            }
        }
        return w;
    }

    @Override
    public void handleNotification(Notification n, Object handback) {
        if (!GarbageCollectionNotificationInfo.GARBAGE_COLLECTION_NOTIFICATION.equals(n.getType())) {
            return;
        }
        var info = GarbageCollectionNotificationInfo.from((CompositeData) n.getUserData()).getGcInfo();
        peakBefore.accumulateAndGet(used(info.getMemoryUsageBeforeGc()), Math::max);
        peakAfter.accumulateAndGet(used(info.getMemoryUsageAfterGc()), Math::max);
    }

    private static long used(Map<String, MemoryUsage> pools) {
        long sum = 0;
        for (var pool : ManagementFactory.getMemoryPoolMXBeans()) {
            MemoryUsage u = pools.get(pool.getName());
            if (u != null && pool.getType() == java.lang.management.MemoryType.HEAP) {
                sum += u.getUsed();
            }
        }
        return sum;
    }

    /** Stops watching and returns one line, e.g. {@code peak heap 900 MB in use, 400 MB live after GC, of 1500 MB}. */
    String stop() {
        for (NotificationEmitter e : emitters) {
            try {
                e.removeNotificationListener(this);
            } catch (ListenerNotFoundException ignored) {
                // already gone: nothing to remove
            }
        }
        long now = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
        return String.format(java.util.Locale.ROOT, "peak heap %.0f MB in use, %.0f MB live after GC, of %.0f MB max",
                Math.max(peakBefore.get(), now) / 1048576.0, peakAfter.get() / 1048576.0,
                Runtime.getRuntime().maxMemory() / 1048576.0);
    }
}

"use client";
// The ladder bench's data: the course through its route, and every change as a mutation that
// reloads it. A reorder is shown at once (optimistic) and put back if the server refuses it.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CourseView } from "@/lib/courses/api-types";
import type { LadderOrder } from "@/lib/courses/rules";
import { teachFetch } from "@/lib/tunes/client-fetch";

export const courseKey = (id: string) => ["teach-course", id] as const;

export function useCourse(courseId: string) {
  return useQuery({
    queryKey: courseKey(courseId),
    queryFn: () => teachFetch<CourseView>(`/api/teach/courses/${courseId}`),
  });
}

export interface CourseCall {
  /** Path under /api/teach/courses/{id}, e.g. "/rungs" or "" for the course itself. */
  path: string;
  method: "POST" | "PATCH" | "DELETE" | "PUT";
  body?: unknown;
}

export function useCourseAction(courseId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (c: CourseCall) =>
      teachFetch<unknown>(`/api/teach/courses/${courseId}${c.path}`, { method: c.method, body: c.body }),
    onSettled: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: courseKey(courseId) }),
        client.invalidateQueries({ queryKey: ["teach-courses"] }),
      ]),
  });
}

/** The course as it would look in `order` (for the optimistic update). */
function reordered(course: CourseView, order: LadderOrder): CourseView {
  const rungs = new Map(course.grades.flatMap((g) => g.rungs).map((r) => [r.id, r]));
  const grades = new Map(course.grades.map((g) => [g.id, g]));
  return {
    ...course,
    grades: order.grades.flatMap((o) => {
      const g = grades.get(o.id);
      return g ? [{ ...g, rungs: o.rungs.flatMap((id) => rungs.get(id) ?? []) }] : [];
    }),
  };
}

export function useReorder(courseId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (order: LadderOrder) =>
      teachFetch<unknown>(`/api/teach/courses/${courseId}/order`, { method: "PUT", body: order }),
    onMutate: async (order) => {
      await client.cancelQueries({ queryKey: courseKey(courseId) });
      const before = client.getQueryData<CourseView>(courseKey(courseId));
      if (before) client.setQueryData(courseKey(courseId), reordered(before, order));
      return { before };
    },
    onError: (_e, _order, context) => {
      if (context?.before) client.setQueryData(courseKey(courseId), context.before);
    },
    onSettled: () => client.invalidateQueries({ queryKey: courseKey(courseId) }),
  });
}
